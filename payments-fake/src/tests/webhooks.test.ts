import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { createPassengerCard, PASSENGER, startFake, startReceiver, waitFor, type Receiver, type RunningFake } from './harness.js';

// Signatures are checked with stripe-node 23.1's own `webhooks.constructEvent`, which implements Stripe's documented
// scheme (stripe.com/docs/webhooks/signatures: `t=…,v1=` hex HMAC-SHA256 of "t.payload"; the SDK allows 300 s of clock skew).
// Delivery semantics per Stripe's webhook docs: at-least-once, retried with exponential backoff, events may be
// duplicated or arrive out of order.

const SECRET = 'whsec_local_test_secret';
const BASE_DELAY_MS = 40;
const MAX_ATTEMPTS = 3;

let running: RunningFake;
let receiver: Receiver | null = null;

async function receiveWith(answer?: (index: number) => number): Promise<Receiver> {
  receiver = await startReceiver(answer);
  await running.control('POST', '/webhooks/endpoint', { url: receiver.url, secret: SECRET });
  return receiver;
}

function verify(delivery: { headers: Record<string, unknown>; body: string }): Stripe.Event {
  return Stripe.webhooks.constructEvent(delivery.body, String(delivery.headers['stripe-signature']), SECRET);
}

beforeAll(async () => {
  running = await startFake({ webhookRetry: { baseDelayMs: BASE_DELAY_MS, maxDelayMs: 1_000, maxAttempts: MAX_ATTEMPTS, requestTimeoutMs: 1_000 } });
});
afterAll(async () => {
  await running.stop();
});
beforeEach(() => {
  running.fake.reset();
});
afterEach(async () => {
  await receiver?.close();
  receiver = null;
});

describe('signed webhook delivery', () => {
  it('signs each event so stripe.webhooks.constructEvent accepts it, in creation order', async () => {
    const hook = await receiveWith();
    const { card } = await createPassengerCard(running.stripe, 60_000);
    await waitFor(() => hook.received.length === 2, 5_000, 'two deliveries');
    const events = hook.received.map(verify);
    expect(events.map((e) => e.type)).toEqual(['issuing_cardholder.created', 'issuing_card.created']);
    expect((events[1].data.object as { id: string }).id).toBe(card.id);
    expect(hook.received[0].headers['content-type']).toContain('application/json');
    await waitFor(() => running.fake.webhooks.deliveries().every((d) => d.status === 'delivered'), 2_000, 'delivered state');
    expect((await running.stripe.events.retrieve(events[1].id)).pending_webhooks).toBe(0);
  });

  it('fails verification with the wrong secret', async () => {
    const hook = await receiveWith();
    await running.stripe.issuing.cardholders.create(PASSENGER);
    await waitFor(() => hook.received.length === 1);
    const [delivery] = hook.received;
    expect(() => Stripe.webhooks.constructEvent(delivery.body, String(delivery.headers['stripe-signature']), 'whsec_other')).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
  });

  it('retries with growing delays until the receiver answers 2xx, re-signing every attempt', async () => {
    const arrivals: number[] = [];
    const hook = await receiveWith((index) => {
      arrivals.push(Date.now());
      return index < 2 ? 500 : 200;
    });
    await running.stripe.issuing.cardholders.create(PASSENGER);
    await waitFor(() => hook.received.length === 3, 5_000, 'three attempts');
    const events = hook.received.map(verify);
    expect(new Set(events.map((e) => e.id)).size).toBe(1);
    // Backoff base, then 2 × base (derived from the configured policy); timers never fire early.
    expect(arrivals[1] - arrivals[0]).toBeGreaterThanOrEqual(BASE_DELAY_MS - 5);
    expect(arrivals[2] - arrivals[1]).toBeGreaterThanOrEqual(2 * BASE_DELAY_MS - 5);
    await waitFor(() => running.fake.webhooks.deliveries()[0]?.status === 'delivered', 2_000, 'delivered');
    expect(running.fake.webhooks.deliveries()[0].attempts).toBe(3);
  });

  it('gives up after the bounded number of attempts and marks the delivery failed', async () => {
    const hook = await receiveWith(() => 500);
    await running.stripe.issuing.cardholders.create(PASSENGER);
    await waitFor(() => running.fake.webhooks.deliveries()[0]?.status === 'failed', 5_000, 'failed');
    await new Promise((resolve) => setTimeout(resolve, 4 * BASE_DELAY_MS * 2 ** MAX_ATTEMPTS));
    expect(hook.received).toHaveLength(MAX_ATTEMPTS);
  });
});

describe('webhook faults', () => {
  it('duplicates the next event when asked: same event id delivered twice', async () => {
    const hook = await receiveWith();
    await running.control('POST', '/webhooks/faults', { kind: 'duplicate', count: 1 });
    await running.stripe.issuing.cardholders.create(PASSENGER);
    await running.stripe.issuing.cardholders.create(PASSENGER);
    await waitFor(() => hook.received.length === 3, 5_000, 'three deliveries');
    const ids = hook.received.map((d) => verify(d).id);
    expect(ids[0]).toBe(ids[1]);
    expect(ids[2]).not.toBe(ids[0]);
  });

  it('duplicates by probability, deterministically for a seed', async () => {
    const hook = await receiveWith();
    await running.control('POST', '/webhooks/faults', { kind: 'duplicate', probability: 1, seed: 3, count: 2 });
    for (let i = 0; i < 3; i += 1) await running.stripe.issuing.cardholders.create(PASSENGER);
    await waitFor(() => hook.received.length === 5, 5_000, 'five deliveries');
  });

  it('reorders a batch: the next N events arrive newest first', async () => {
    const hook = await receiveWith();
    await running.control('POST', '/webhooks/faults', { kind: 'reorder', count: 3 });
    const { card } = await createPassengerCard(running.stripe, 60_000);
    await running.stripe.issuing.cards.update(card.id, { status: 'canceled' });
    await waitFor(() => hook.received.length === 3, 5_000, 'three deliveries');
    expect(hook.received.map((d) => verify(d).type)).toEqual(['issuing_card.updated', 'issuing_card.created', 'issuing_cardholder.created']);
  });

  it('delays the next event', async () => {
    const hook = await receiveWith();
    await running.control('POST', '/webhooks/faults', { kind: 'delay', delayMs: 300, count: 1 });
    const started = Date.now();
    await running.stripe.issuing.cardholders.create(PASSENGER);
    await waitFor(() => hook.received.length === 1, 5_000, 'delayed delivery');
    expect(Date.now() - started).toBeGreaterThanOrEqual(295);
  });
});

describe('simulated settlement', () => {
  it('records a capture transaction and emits issuing_transaction.created', async () => {
    const hook = await receiveWith();
    const { card } = await createPassengerCard(running.stripe, 60_000);
    const settled = await running.control('POST', `/issuing/cards/${card.id}/settle`, { amount: 45_000, merchant_name: 'Airport hotel' });
    expect(settled.status).toBe(200);
    expect(settled.json.object).toBe('issuing.transaction');
    // Captures reduce the Issuing balance, so the transaction amount is negative (Stripe Issuing transactions, from memory).
    expect(settled.json.amount).toBe(-45_000);
    await waitFor(() => hook.received.length === 3, 5_000, 'three deliveries');
    const event = verify(hook.received[2]);
    expect(event.type).toBe('issuing_transaction.created');
    const transactions = await running.stripe.issuing.transactions.list({ card: card.id });
    expect(transactions.data.map((t) => t.id)).toEqual([settled.json.id]);

    const overspend = await running.control('POST', `/issuing/cards/${card.id}/settle`, { amount: 15_001 });
    expect(overspend.status).toBe(400);
    expect(overspend.json.error.param).toBe('amount');
    const rest = await running.control('POST', `/issuing/cards/${card.id}/settle`, {});
    expect(rest.json.amount).toBe(-15_000); // defaults to what is left of the 60 000 limit (derived)
  });
});
