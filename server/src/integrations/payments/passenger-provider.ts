// What the provider does for the passenger directly, over the real SDK: show a card's full details through an
// ephemeral key (Stripe Issuing, "Display card details": an ephemeral key made with a nonce, then the card retrieved
// with that key and expand number/cvc), and pay a bank transfer as a Treasury OutboundPayment from the carrier's
// financial account to a us_bank_account payment method (Stripe Treasury, "Moving money with OutboundPayments").
// The card details are returned to the caller and nowhere else: no log line, no error message carries them.
import { randomBytes } from 'node:crypto';
import Stripe from 'stripe';

export interface CardDetails {
  number: string;
  cvc: string;
  expMonth: number;
  expYear: number;
  last4: string;
}

export interface BankAccountInput {
  holderName: string;
  routingNumber: string;
  accountNumber: string;
  accountType: 'checking' | 'savings';
  metadata: Record<string, string>;
}

export interface OutboundPaymentInput {
  amountMinor: number;
  currency: string;
  paymentMethodId: string;
  description: string;
  metadata: Record<string, string>;
}

export interface OutboundPaymentSnapshot {
  id: string;
  status: string;
  amountMinor: number;
  currency: string;
  compensationId: number | null;
  /** The station whose compensation it pays, from its metadata. */
  stationId: number | null;
  returnCode: string | null;
}

export interface PassengerPaymentsProvider {
  readCardDetails(cardId: string): Promise<CardDetails>;
  createBankAccount(input: BankAccountInput, idempotencyKey: string): Promise<{ id: string; last4: string }>;
  createOutboundPayment(input: OutboundPaymentInput, idempotencyKey: string): Promise<OutboundPaymentSnapshot>;
  /** One page of the carrier's financial account's outbound payments, newest first (Stripe's list pagination). */
  listOutboundPayments(startingAfter: string | null, limit: number): Promise<{ items: OutboundPaymentSnapshot[]; hasMore: boolean; lastId: string | null }>;
}

export function outboundSnapshotOf(payment: Stripe.Treasury.OutboundPayment): OutboundPaymentSnapshot {
  const id = payment.metadata?.compensationId;
  const station = payment.metadata?.stationId;
  return {
    id: payment.id,
    status: payment.status,
    amountMinor: payment.amount,
    currency: payment.currency.toUpperCase(),
    compensationId: id && /^\d+$/.test(id) ? Number(id) : null,
    stationId: station && /^\d+$/.test(station) ? Number(station) : null,
    returnCode: payment.returned_details?.code ?? null,
  };
}

/** A provider error with nothing of the request in it: card numbers and account numbers must not reach a log. */
function scrubbed(error: unknown, step: string): Error {
  if (error instanceof Stripe.errors.StripeError) {
    const clean = new Error(`${step}: ${error.statusCode ?? 'no answer'} ${error.code ?? error.type}`);
    return Object.assign(clean, { statusCode: error.statusCode, retryable: error.statusCode === undefined || error.statusCode >= 500 || error.statusCode === 429 || error.statusCode === 409, param: error.param });
  }
  return new Error(`${step}: ${(error as Error)?.name ?? 'error'}`);
}

export function stripePassengerProvider(stripe: Stripe, financialAccount: string): PassengerPaymentsProvider {
  return {
    async readCardDetails(cardId) {
      try {
        // The nonce binds the key to this one reading; Stripe.js would make it on the phone, here the server reads on
        // the passenger's behalf and hands the answer straight to their page.
        const nonce = randomBytes(24).toString('base64url');
        const key = await stripe.ephemeralKeys.create({ issuing_card: cardId, nonce }, { apiVersion: Stripe.API_VERSION });
        if (!key.secret) throw new Error('the provider gave no ephemeral key secret');
        const card = await stripe.issuing.cards.retrieve(cardId, { expand: ['number', 'cvc'] }, { apiKey: key.secret });
        if (!card.number || !card.cvc) throw new Error('the provider gave no card details');
        return { number: card.number, cvc: card.cvc, expMonth: card.exp_month, expYear: card.exp_year, last4: card.last4 };
      } catch (error) {
        throw scrubbed(error, 'reading the card details');
      }
    },
    async createBankAccount(input, idempotencyKey) {
      try {
        const method = await stripe.paymentMethods.create(
          {
            type: 'us_bank_account',
            us_bank_account: { account_holder_type: 'individual', account_type: input.accountType, routing_number: input.routingNumber, account_number: input.accountNumber },
            billing_details: { name: input.holderName },
            metadata: input.metadata,
          },
          { idempotencyKey },
        );
        return { id: method.id, last4: method.us_bank_account?.last4 ?? input.accountNumber.slice(-4) };
      } catch (error) {
        throw scrubbed(error, 'saving the bank account');
      }
    },
    async createOutboundPayment(input, idempotencyKey) {
      const payment = await stripe.treasury.outboundPayments.create(
        {
          financial_account: financialAccount,
          amount: input.amountMinor,
          currency: input.currency.toLowerCase(),
          destination_payment_method: input.paymentMethodId,
          description: input.description,
          metadata: input.metadata,
        },
        { idempotencyKey },
      );
      return outboundSnapshotOf(payment);
    },
    async listOutboundPayments(startingAfter, limit) {
      const page = await stripe.treasury.outboundPayments.list({ financial_account: financialAccount, limit, ...(startingAfter ? { starting_after: startingAfter } : {}) });
      return { items: page.data.map(outboundSnapshotOf), hasMore: page.has_more, lastId: page.data.at(-1)?.id ?? null };
    },
  };
}
