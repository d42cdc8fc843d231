// Bank transfers through the stand-in with stripe-node 23.1: a us_bank_account payment method, a Treasury
// OutboundPayment from a financial account, and the test helpers that post, fail or return it, each with its event.
// Outside sources: Stripe Treasury docs "OutboundPayments" (statuses processing, posted, failed, returned; test
// helpers) and the ABA routing number check digit with weights 3-7-1; Stripe's test routing number 110000000 — from
// memory.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type Stripe from 'stripe';
import { abaValid } from '../resources/outboundPayments.js';
import { cardNumberEnding, luhnValid } from '../resources/cardSecrets.js';
import { startFake, type RunningFake } from './harness.js';

let running: RunningFake;
let stripe: Stripe;

beforeAll(async () => {
  running = await startFake();
  stripe = running.client({ maxNetworkRetries: 0 });
});
afterAll(async () => {
  await running.stop();
});
beforeEach(() => {
  running.fake.reset();
});

const bank = () => stripe.paymentMethods.create({ type: 'us_bank_account', us_bank_account: { routing_number: '110000000', account_number: '000123456789', account_type: 'checking', account_holder_type: 'individual' }, billing_details: { name: 'Ana Tester' } });

describe('check digits', () => {
  it('knows valid and invalid ABA routing numbers', () => {
    // 110000000: Stripe's test routing number; 021000021 a widely printed example routing number (from memory).
    expect(abaValid('110000000')).toBe(true);
    expect(abaValid('021000021')).toBe(true);
    expect(abaValid('110000001')).toBe(false);
    expect(abaValid('11000000')).toBe(false);
  });

  it('makes card numbers that end in the card’s last four and pass the Luhn check', () => {
    // 4111 1111 1111 1111 and 4242 4242 4242 4242: well-known test numbers that pass Luhn (from memory).
    expect(luhnValid('4111111111111111')).toBe(true);
    expect(luhnValid('4242424242424242')).toBe(true);
    expect(luhnValid('4242424242424241')).toBe(false);
    for (const last4 of ['0000', '1234', '9999', '0420']) {
      const number = cardNumberEnding(last4);
      expect(number).toMatch(/^\d{16}$/);
      expect(number.endsWith(last4)).toBe(true);
      expect(luhnValid(number)).toBe(true);
    }
  });
});

describe('Treasury outbound payments', () => {
  it('keeps only the last four digits of the account, and refuses a bad routing number by name', async () => {
    const method = await bank();
    expect(method.us_bank_account).toMatchObject({ last4: '6789', routing_number: '110000000' });
    expect(JSON.stringify(running.fake.store.state.paymentMethods.get(method.id))).not.toContain('000123456789');
    await expect(stripe.paymentMethods.create({ type: 'us_bank_account', us_bank_account: { routing_number: '110000001', account_number: '0001234' } })).rejects.toMatchObject({ statusCode: 400, param: 'us_bank_account[routing_number]' });
  });

  it('sends, posts and returns a transfer with one event per step; a wrong step is refused', async () => {
    const method = await bank();
    const payment = await stripe.treasury.outboundPayments.create({ financial_account: 'fa_test', amount: 40_000, currency: 'usd', destination_payment_method: method.id, metadata: { attemptKey: 'comp-1' } }, { idempotencyKey: 'k1' });
    expect(payment).toMatchObject({ status: 'processing', amount: 40_000, currency: 'usd' });
    const again = await stripe.treasury.outboundPayments.create({ financial_account: 'fa_test', amount: 40_000, currency: 'usd', destination_payment_method: method.id, metadata: { attemptKey: 'comp-1' } }, { idempotencyKey: 'k1' });
    expect(again.id).toBe(payment.id);
    await expect(stripe.testHelpers.treasury.outboundPayments.returnOutboundPayment(payment.id)).rejects.toMatchObject({ statusCode: 400 });
    expect((await stripe.testHelpers.treasury.outboundPayments.post(payment.id)).status).toBe('posted');
    await expect(stripe.testHelpers.treasury.outboundPayments.fail(payment.id)).rejects.toMatchObject({ statusCode: 400 });
    const returned = await stripe.testHelpers.treasury.outboundPayments.returnOutboundPayment(payment.id, { returned_details: { code: 'account_closed' } });
    expect(returned).toMatchObject({ status: 'returned', returned_details: { code: 'account_closed' } });
    const types = [...running.fake.store.state.events.values()].map((e) => e.type).filter((t) => t.startsWith('treasury.'));
    expect(types).toEqual(['treasury.outbound_payment.created', 'treasury.outbound_payment.posted', 'treasury.outbound_payment.returned']);
  });

  it('moves US dollars only, from a financial account, to a payment method it knows', async () => {
    const method = await bank();
    await expect(stripe.treasury.outboundPayments.create({ financial_account: 'fa_test', amount: 100, currency: 'eur', destination_payment_method: method.id })).rejects.toMatchObject({ param: 'currency' });
    await expect(stripe.treasury.outboundPayments.create({ financial_account: 'acct_x', amount: 100, currency: 'usd', destination_payment_method: method.id })).rejects.toMatchObject({ param: 'financial_account' });
    await expect(stripe.treasury.outboundPayments.create({ financial_account: 'fa_test', amount: 100, currency: 'usd', destination_payment_method: 'pm_missing' })).rejects.toMatchObject({ param: 'destination_payment_method' });
  });
});
