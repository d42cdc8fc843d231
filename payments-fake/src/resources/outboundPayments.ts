import { Router } from 'express';
import { ID_PREFIX, newId } from '../ids.js';
import { paramInvalid, resourceMissing, StripeApiError } from '../http/errors.js';
import { endpoint, type RunnerDeps } from '../http/runner.js';
import type { Operation } from '../http/types.js';
import type { OutboundPaymentObject, OutboundPaymentStatus, PaymentMethodObject } from '../store/types.js';
import { nowSeconds, originOf, type ResourceDeps } from './context.js';
import { newestFirst, paginate, parseListQuery } from './list.js';
import { applyMetadata } from './metadata.js';
import { asObject, optionalEnum, optionalString, parseCurrency, parseInteger, rejectUnknown, requiredString } from './params.js';

// A bank transfer to a person's own account: Stripe Treasury OutboundPayments (POST /v1/treasury/outbound_payments)
// from the carrier's financial account to a `us_bank_account` payment method, settled through the test helpers
// post / fail / return, each with its `treasury.outbound_payment.*` event (stripe-node 23.1 Treasury.OutboundPayment
// and TestHelpers.Treasury.OutboundPayments). Treasury moves US dollars only.

/** ABA routing number check: 3·d1 + 7·d2 + d3 + 3·d4 + … ≡ 0 (mod 10) (ABA routing number policy, from memory). */
export function abaValid(routing: string): boolean {
  if (!/^\d{9}$/.test(routing)) return false;
  const w = [3, 7, 1, 3, 7, 1, 3, 7, 1];
  return [...routing].reduce((sum, d, i) => sum + Number(d) * w[i], 0) % 10 === 0;
}

const RETURN_CODES = ['account_closed', 'account_frozen', 'bank_account_restricted', 'bank_ownership_changed', 'declined', 'incorrect_account_holder_name', 'invalid_account_number', 'invalid_currency', 'no_account', 'other'] as const;

const createPaymentMethod =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    rejectUnknown(p, ['type', 'us_bank_account', 'billing_details', 'metadata'], ['card', 'customer', 'sepa_debit', 'allow_redisplay']);
    const type = requiredString(p.type, 'type');
    if (type !== 'us_bank_account') throw paramInvalid('type', 'this stand-in makes us_bank_account payment methods only.');
    const bank = asObject(p.us_bank_account, 'us_bank_account');
    rejectUnknown(bank, ['account_holder_type', 'account_number', 'routing_number', 'account_type'], ['financial_connections_account'], 'us_bank_account');
    const routing = requiredString(bank.routing_number, 'us_bank_account[routing_number]', 9);
    if (!abaValid(routing)) throw paramInvalid('us_bank_account[routing_number]', 'expected a 9-digit ABA routing number with a valid check digit.');
    const account = requiredString(bank.account_number, 'us_bank_account[account_number]', 17);
    if (!/^\d{4,17}$/.test(account)) throw paramInvalid('us_bank_account[account_number]', 'expected 4 to 17 digits.');
    const holderType = optionalEnum(bank.account_holder_type, 'us_bank_account[account_holder_type]', ['individual', 'company'] as const) ?? 'individual';
    const accountType = optionalEnum(bank.account_type, 'us_bank_account[account_type]', ['checking', 'savings'] as const) ?? 'checking';
    const billing = asObject(p.billing_details, 'billing_details');
    rejectUnknown(billing, ['name', 'email'], ['address', 'phone'], 'billing_details');
    const method: PaymentMethodObject = {
      id: newId(ID_PREFIX.paymentMethod),
      object: 'payment_method',
      billing_details: { name: optionalString(billing.name, 'billing_details[name]', 200) ?? null, email: optionalString(billing.email, 'billing_details[email]', 200) ?? null },
      created: nowSeconds(deps),
      livemode: false,
      metadata: applyMetadata({}, p.metadata),
      type: 'us_bank_account',
      // The full account number is not kept: Stripe shows back only the last four digits.
      us_bank_account: { account_holder_type: holderType, account_type: accountType, bank_name: 'STAND-IN TEST BANK', last4: account.slice(-4), routing_number: routing },
    };
    deps.store.state.paymentMethods.set(method.id, method);
    return { status: 200, body: method };
  };

function findPayment(deps: ResourceDeps, id: string): OutboundPaymentObject {
  const payment = deps.store.state.outboundPayments.get(id);
  if (!payment) throw resourceMissing('treasury.outbound_payment', id);
  return payment;
}

const createPayment =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    rejectUnknown(p, ['amount', 'currency', 'financial_account', 'destination_payment_method', 'description', 'statement_descriptor', 'metadata'],
      ['customer', 'destination_payment_method_data', 'destination_payment_method_options', 'end_user_details']);
    const amount = parseInteger(p.amount, 'amount', 1);
    const currency = parseCurrency(p.currency, 'currency');
    if (currency !== 'usd') throw paramInvalid('currency', 'Treasury outbound payments move usd only.');
    const financialAccount = requiredString(p.financial_account, 'financial_account', 64);
    if (!financialAccount.startsWith('fa_')) throw paramInvalid('financial_account', 'expected a financial account id (fa_…).');
    const methodId = requiredString(p.destination_payment_method, 'destination_payment_method');
    if (!deps.store.state.paymentMethods.has(methodId)) throw resourceMissing('payment_method', methodId, 'destination_payment_method');
    const payment: OutboundPaymentObject = {
      id: newId(ID_PREFIX.outboundPayment),
      object: 'treasury.outbound_payment',
      amount,
      created: nowSeconds(deps),
      currency,
      description: optionalString(p.description, 'description', 1000) ?? null,
      destination_payment_method: methodId,
      financial_account: financialAccount,
      livemode: false,
      metadata: applyMetadata({}, p.metadata),
      returned_details: null,
      statement_descriptor: optionalString(p.statement_descriptor, 'statement_descriptor', 10) ?? 'payment',
      status: 'processing',
      status_transitions: { posted_at: null, failed_at: null, returned_at: null, canceled_at: null },
    };
    deps.store.state.outboundPayments.set(payment.id, payment);
    deps.events.emit('treasury.outbound_payment.created', payment, originOf(input));
    return { status: 200, body: payment };
  };

const retrievePayment =
  (deps: ResourceDeps): Operation =>
  (input) => {
    rejectUnknown(input.params, []);
    return { status: 200, body: findPayment(deps, input.pathParams.id) };
  };

const listPayments =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    const query = parseListQuery(p, ['financial_account', 'status'], ['customer']);
    const financialAccount = requiredString(p.financial_account, 'financial_account');
    const status = optionalEnum(p.status, 'status', ['processing', 'posted', 'failed', 'returned', 'canceled'] as const);
    const page = paginate(newestFirst(deps.store.state.outboundPayments.values()), query,
      (o) => o.financial_account === financialAccount && (!status || o.status === status), '/v1/treasury/outbound_payments', 'treasury.outbound_payment');
    return { status: 200, body: page };
  };

/** Test helpers: the bank's answer. Only a processing payment posts or fails; only a posted one comes back. */
function transition(deps: ResourceDeps, to: Exclude<OutboundPaymentStatus, 'processing' | 'canceled'>): Operation {
  return (input) => {
    const p = input.params;
    rejectUnknown(p, to === 'returned' ? ['returned_details'] : []);
    const payment = findPayment(deps, input.pathParams.id);
    const from: OutboundPaymentStatus = to === 'returned' ? 'posted' : 'processing';
    if (payment.status !== from) {
      throw new StripeApiError(400, 'invalid_request_error', `Outbound payment ${payment.id} is ${payment.status}; only a ${from} payment can become ${to}.`, 'outbound_payment_invalid_state');
    }
    let code: (typeof RETURN_CODES)[number] = 'declined';
    if (to === 'returned') {
      const details = asObject(p.returned_details, 'returned_details');
      rejectUnknown(details, ['code'], [], 'returned_details');
      code = optionalEnum(details.code, 'returned_details[code]', RETURN_CODES) ?? 'declined';
    }
    const previous = { status: payment.status };
    payment.status = to;
    const at = nowSeconds(deps);
    if (to === 'posted') payment.status_transitions.posted_at = at;
    if (to === 'failed') payment.status_transitions.failed_at = at;
    if (to === 'returned') {
      payment.status_transitions.returned_at = at;
      payment.returned_details = { code };
    }
    deps.events.emit(`treasury.outbound_payment.${to}`, payment, originOf(input), previous);
    return { status: 200, body: payment };
  };
}

export function paymentMethodsRouter(deps: ResourceDeps, runner: RunnerDeps): Router {
  const router = Router();
  router.post('/', endpoint(createPaymentMethod(deps), runner));
  return router;
}

export function outboundPaymentsRouter(deps: ResourceDeps, runner: RunnerDeps): Router {
  const router = Router();
  router.post('/', endpoint(createPayment(deps), runner));
  router.get('/', endpoint(listPayments(deps), runner));
  router.get('/:id', endpoint(retrievePayment(deps), runner));
  return router;
}

export function outboundPaymentHelpersRouter(deps: ResourceDeps, runner: RunnerDeps): Router {
  const router = Router();
  router.post('/:id/post', endpoint(transition(deps, 'posted'), runner));
  router.post('/:id/fail', endpoint(transition(deps, 'failed'), runner));
  router.post('/:id/return', endpoint(transition(deps, 'returned'), runner));
  return router;
}
