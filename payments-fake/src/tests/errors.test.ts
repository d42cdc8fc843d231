import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { createPassengerCard, PASSENGER, startFake, type RunningFake } from './harness.js';

let running: RunningFake;

beforeAll(async () => {
  running = await startFake();
});
afterAll(async () => {
  await running.stop();
});
beforeEach(() => {
  running.fake.reset();
});

describe('authentication', () => {
  it('answers 401 in Stripe error shape without a key', async () => {
    const response = await fetch(`${running.baseUrl}/v1/issuing/cards`);
    expect(response.status).toBe(401);
    const body = await response.json();
    expect(body.error.type).toBe('invalid_request_error');
    expect(response.headers.get('request-id')).toMatch(/^req_/);
  });

  it('maps a bad key to StripeAuthenticationError in the SDK and refuses live keys', async () => {
    const options = { host: '127.0.0.1', port: running.port, protocol: 'http' as const, telemetry: false };
    await expect(new Stripe('pk_test_wrong', options).issuing.cards.list()).rejects.toMatchObject({
      type: 'StripeAuthenticationError',
      statusCode: 401,
    });
    await expect(new Stripe('sk_live_real', options).issuing.cards.list()).rejects.toMatchObject({
      statusCode: 401,
      code: 'api_key_live_mode',
    });
  });
});

describe('parameter errors (400 invalid_request_error naming the param)', () => {
  it('names a missing required param', async () => {
    const cardholder = await running.stripe.issuing.cardholders.create(PASSENGER);
    await expect(
      running.stripe.issuing.cards.create({ cardholder: cardholder.id, type: 'virtual' } as Stripe.Issuing.CardCreateParams),
    ).rejects.toMatchObject({ type: 'StripeInvalidRequestError', statusCode: 400, param: 'currency', code: 'parameter_missing' });
  });

  it('names a nested invalid param: amounts are integer minor units', async () => {
    const cardholder = await running.stripe.issuing.cardholders.create(PASSENGER);
    await expect(
      running.stripe.issuing.cards.create({
        cardholder: cardholder.id,
        currency: 'eur',
        type: 'virtual',
        spending_controls: { spending_limits: [{ amount: 12.5, interval: 'all_time' }] },
      }),
    ).rejects.toMatchObject({ statusCode: 400, param: 'spending_controls[spending_limits][0][amount]' });
  });

  it('rejects a currency that is not ISO 4217', async () => {
    const cardholder = await running.stripe.issuing.cardholders.create(PASSENGER);
    await expect(
      running.stripe.issuing.cards.create({ cardholder: cardholder.id, currency: 'eu', type: 'virtual' }),
    ).rejects.toMatchObject({ statusCode: 400, param: 'currency' });
  });

  it('rejects an unknown parameter by name, as Stripe does', async () => {
    await expect(
      running.stripe.issuing.cardholders.create({ ...PASSENGER, nickname: 'x' } as Stripe.Issuing.CardholderCreateParams),
    ).rejects.toMatchObject({ statusCode: 400, param: 'nickname', code: 'parameter_unknown' });
  });

  it('enforces the 24-character cardholder name printed on cards (stripe-node 23.1 CardholderCreateParams.name)', async () => {
    await expect(
      running.stripe.issuing.cardholders.create({ ...PASSENGER, name: 'Maximiliana Alexandrina Constantinopla' }),
    ).rejects.toMatchObject({ statusCode: 400, param: 'name' });
    await expect(running.stripe.issuing.cardholders.create({ ...PASSENGER, name: 'Seat 12A' })).rejects.toMatchObject({
      param: 'name',
    });
  });

  it('requires the billing address fields', async () => {
    const withoutPostalCode = { ...PASSENGER, billing: { address: { line1: 'x', city: 'y', country: 'PT' } } };
    await expect(
      running.stripe.issuing.cardholders.create(withoutPostalCode as unknown as Stripe.Issuing.CardholderCreateParams),
    ).rejects.toMatchObject({ param: 'billing[address][postal_code]' });
  });

  it('names an unknown cardholder on card creation as resource_missing', async () => {
    await expect(
      running.stripe.issuing.cards.create({ cardholder: 'ich_missing', currency: 'eur', type: 'virtual' }),
    ).rejects.toMatchObject({ statusCode: 400, code: 'resource_missing', param: 'cardholder' });
  });
});

describe('missing objects and routes', () => {
  it('answers 404 resource_missing for an unknown card id', async () => {
    await expect(running.stripe.issuing.cards.retrieve('ic_missing')).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 404,
      code: 'resource_missing',
    });
  });

  it('answers 404 for an unknown cursor and an unknown route', async () => {
    await createPassengerCard(running.stripe, 1_000);
    await expect(running.stripe.issuing.cards.list({ starting_after: 'ic_nope' })).rejects.toMatchObject({
      param: 'starting_after',
    });
    const response = await fetch(`${running.baseUrl}/v1/charges`, { headers: { Authorization: 'Bearer sk_test_x' } });
    expect(response.status).toBe(404);
    expect((await response.json()).error.message).toContain('Unrecognized request URL');
  });

  it('refuses JSON bodies, which the v1 API does not read', async () => {
    const response = await fetch(`${running.baseUrl}/v1/issuing/cardholders`, {
      method: 'POST',
      headers: { Authorization: 'Bearer sk_test_x', 'Content-Type': 'application/json' },
      body: JSON.stringify(PASSENGER),
    });
    expect(response.status).toBe(400);
  });
});
