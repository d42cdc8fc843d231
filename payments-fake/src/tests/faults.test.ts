import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { ApiFaults } from '../faults/apiFaults.js';
import { PASSENGER, startFake, type RunningFake } from './harness.js';

// The retry side is stripe-node 23.1's own logic (RequestSender.js): 5xx responses and connection errors are retried
// with the same Idempotency-Key up to maxNetworkRetries; Stripe's idempotency docs (docs.stripe.com/api/idempotent_requests)
// say such a retry is safe because a request that already ran is answered from the saved result.

let running: RunningFake;
let cardholderId: string;

const cardParams = (): Stripe.Issuing.CardCreateParams => ({
  cardholder: cardholderId,
  currency: 'eur',
  type: 'virtual',
  status: 'active',
  spending_controls: { spending_limits: [{ amount: 60_000, interval: 'all_time' }] },
});

/** Idempotency keys of every attempt the SDK sends (its 'request' event fires once per attempt). */
function recordAttempts(stripe: Stripe): string[] {
  const keys: string[] = [];
  stripe.on('request', (event: { idempotency_key?: string }) => keys.push(event.idempotency_key ?? ''));
  return keys;
}

async function cardCount(): Promise<number> {
  return (await running.stripe.issuing.cards.list({ limit: 100 })).data.length;
}

beforeAll(async () => {
  running = await startFake();
});
afterAll(async () => {
  await running.stop();
});
beforeEach(async () => {
  running.fake.reset();
  cardholderId = (await running.stripe.issuing.cardholders.create(PASSENGER)).id;
});

describe('500 faults', () => {
  it('before the endpoint: the SDK retries with its key and exactly one card exists', async () => {
    const stripe = running.client();
    const attempts = recordAttempts(stripe);
    await running.control('POST', '/faults', { kind: 'error500', count: 1, method: 'POST', pathPrefix: '/v1/issuing/cards' });
    const card = await stripe.issuing.cards.create(cardParams());
    expect(attempts).toHaveLength(2);
    expect(attempts[1]).toBe(attempts[0]);
    expect(card.lastResponse.headers['idempotent-replayed']).toBeUndefined();
    expect(await cardCount()).toBe(1);
  });

  it('after the endpoint ran ("applied but the response was lost"): the retry is replayed, still one card', async () => {
    const stripe = running.client();
    const attempts = recordAttempts(stripe);
    await running.control('POST', '/faults', { kind: 'error500', phase: 'after', count: 1, pathPrefix: '/v1/issuing/cards' });
    const card = await stripe.issuing.cards.create(cardParams());
    expect(attempts).toHaveLength(2);
    expect(attempts[1]).toBe(attempts[0]);
    expect(card.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(await cardCount()).toBe(1);
    expect((await stripe.events.list({ type: 'issuing_card.created' })).data).toHaveLength(1);
  });

  it('surfaces StripeAPIError when faults outlast the retries', async () => {
    const stripe = running.client({ maxNetworkRetries: 1 });
    await running.control('POST', '/faults', { kind: 'error500', count: 2, pathPrefix: '/v1/issuing/cards' });
    await expect(stripe.issuing.cards.create(cardParams())).rejects.toMatchObject({ type: 'StripeAPIError', statusCode: 500 });
    expect(await cardCount()).toBe(0);
  });
});

describe('timeouts', () => {
  it('holding the response past the client timeout: the SDK retries and the replay gives one card', async () => {
    const stripe = running.client({ timeout: 300 });
    await running.control('POST', '/faults', { kind: 'timeout', holdMs: 1_500, count: 1, method: 'POST', pathPrefix: '/v1/issuing/cards' });
    const card = await stripe.issuing.cards.create(cardParams());
    expect(card.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(await cardCount()).toBe(1);
  });

  it('a request delayed before the endpoint arrives after its retry and is answered from the saved result', async () => {
    const stripe = running.client({ timeout: 300 });
    await running.control('POST', '/faults', { kind: 'timeout', phase: 'before', holdMs: 1_200, count: 1, method: 'POST', pathPrefix: '/v1/issuing/cards' });
    const card = await stripe.issuing.cards.create(cardParams());
    await new Promise((resolve) => setTimeout(resolve, 1_400)); // let the held original reach the endpoint
    const cards = await running.stripe.issuing.cards.list();
    expect(cards.data.map((c) => c.id)).toEqual([card.id]);
  }, 10_000);

  it('a GET timeout without retries surfaces as StripeConnectionError', async () => {
    const stripe = running.client({ timeout: 200, maxNetworkRetries: 0 });
    await running.control('POST', '/faults', { kind: 'timeout', holdMs: 800, method: 'GET' });
    await expect(stripe.issuing.cards.list()).rejects.toMatchObject({ type: 'StripeConnectionError' });
  });
});

describe('dropped connections', () => {
  it('dropped after the endpoint ran: the SDK retries and gets the replay, one card', async () => {
    const stripe = running.client();
    await running.control('POST', '/faults', { kind: 'drop', phase: 'after', count: 1, pathPrefix: '/v1/issuing/cards' });
    const card = await stripe.issuing.cards.create(cardParams());
    expect(card.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(await cardCount()).toBe(1);
  });

  it('dropped before the endpoint: nothing was applied, the retry creates the one card', async () => {
    const stripe = running.client();
    await running.control('POST', '/faults', { kind: 'drop', count: 1, pathPrefix: '/v1/issuing/cards' });
    const card = await stripe.issuing.cards.create(cardParams());
    expect(card.lastResponse.headers['idempotent-replayed']).toBeUndefined();
    expect(await cardCount()).toBe(1);
  });
});

describe('fault control', () => {
  it('only hits matching requests and is consumed', async () => {
    await running.control('POST', '/faults', { kind: 'error500', count: 1, method: 'POST', pathPrefix: '/v1/issuing/cards' });
    const stripe = running.client({ maxNetworkRetries: 0 });
    await stripe.issuing.cardholders.create(PASSENGER); // different path: unaffected
    expect((await running.control('GET', '/faults')).json.data).toHaveLength(1);
    await expect(stripe.issuing.cards.create(cardParams())).rejects.toMatchObject({ statusCode: 500 });
    expect((await running.control('GET', '/faults')).json.data).toHaveLength(0);
  });

  it('explains a bad fault request by field', async () => {
    const response = await running.control('POST', '/faults', { kind: 'error500', count: -1 });
    expect(response.status).toBe(400);
    expect(response.json.error.param).toBe('count');
  });

  it('is deterministic with a seed: the same seed gives the same fault schedule (derived)', () => {
    const schedule = (seed: number) => {
      const faults = new ApiFaults();
      faults.add({ kind: 'error500', probability: 0.3, seed });
      return Array.from({ length: 40 }, () => (faults.take('POST', '/v1/issuing/cards') ? 'x' : '.')).join('');
    };
    expect(schedule(42)).toBe(schedule(42));
    expect(schedule(42)).not.toBe(schedule(7));
    expect(schedule(42)).toContain('x');
    expect(schedule(42)).toContain('.');
  });
});
