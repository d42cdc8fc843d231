import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { PASSENGER, startFake, type RunningFake } from './harness.js';

// Behaviour checked against Stripe's "Idempotent requests" documentation (docs.stripe.com/api/idempotent_requests,
// docs.stripe.com/idempotency): the status and body of the first request are saved and returned for the same key;
// the idempotency layer compares incoming parameters with the original and errors if they differ; keys may be pruned
// after they are at least 24 hours old; results are saved only once the endpoint starts executing, so requests that
// fail validation can be retried; keys are up to 255 characters.

let clockMs = Date.UTC(2026, 5, 1, 8, 0, 0);
let running: RunningFake;
let stripe: Stripe;
let cardholderId: string;

function cardParams(amount: number): Stripe.Issuing.CardCreateParams {
  return {
    cardholder: cardholderId,
    currency: 'eur',
    type: 'virtual',
    status: 'active',
    spending_controls: { spending_limits: [{ amount, interval: 'all_time' }] },
    metadata: { caseId: 'case-042' },
  };
}

beforeAll(async () => {
  running = await startFake({ now: () => clockMs });
  stripe = running.stripe;
});
afterAll(async () => {
  await running.stop();
});
beforeEach(async () => {
  running.fake.reset();
  cardholderId = (await stripe.issuing.cardholders.create(PASSENGER)).id;
});

describe('idempotent requests', () => {
  it('replays the first response for the same key and parameters: same id, same body, Idempotent-Replayed', async () => {
    const first = await stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'comp-case-042' });
    const second = await stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'comp-case-042' });
    expect(second.id).toBe(first.id);
    expect(second).toEqual(first);
    expect(second.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(first.lastResponse.headers['idempotent-replayed']).toBeUndefined();
    expect((await stripe.issuing.cards.list()).data).toHaveLength(1);
  });

  it('answers idempotency_error (400) for the same key with different parameters', async () => {
    await stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'comp-case-042' });
    const attempt = stripe.issuing.cards.create(cardParams(40_000), { idempotencyKey: 'comp-case-042' });
    await expect(attempt).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    await expect(stripe.issuing.cards.create(cardParams(40_000), { idempotencyKey: 'comp-case-042' })).rejects.toMatchObject({
      statusCode: 400,
      rawType: 'idempotency_error',
    });
    expect((await stripe.issuing.cards.list()).data).toHaveLength(1);
  });

  it('answers idempotency_error when the key is reused on another endpoint', async () => {
    await stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'shared-key' });
    await expect(stripe.issuing.cardholders.create(PASSENGER, { idempotencyKey: 'shared-key' })).rejects.toMatchObject({
      rawType: 'idempotency_error',
    });
  });

  it('does not save a validation failure, so the key can be used again', async () => {
    const invalid = { ...cardParams(60_000), currency: 'zzz' };
    await expect(stripe.issuing.cards.create(invalid, { idempotencyKey: 'fix-and-retry' })).rejects.toMatchObject({ param: 'currency' });
    const card = await stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'fix-and-retry' });
    expect(card.currency).toBe('eur');
  });

  it('creates exactly one card when requests with one key arrive concurrently', async () => {
    const results = await Promise.all(
      Array.from({ length: 6 }, () => stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'burst' })),
    );
    expect(new Set(results.map((card) => card.id)).size).toBe(1);
    expect((await stripe.issuing.cards.list()).data).toHaveLength(1);
  });

  it('also dedupes a voiding update', async () => {
    const card = await stripe.issuing.cards.create(cardParams(60_000));
    await stripe.issuing.cards.update(card.id, { status: 'canceled' }, { idempotencyKey: 'void-1' });
    await stripe.issuing.cards.update(card.id, { status: 'canceled' }, { idempotencyKey: 'void-1' });
    const updates = await stripe.events.list({ type: 'issuing_card.updated' });
    expect(updates.data).toHaveLength(1);
  });

  it('forgets keys after 24 hours: the same key then starts a new request', async () => {
    const first = await stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'day-old' });
    clockMs += 24 * 60 * 60 * 1000 - 1000;
    expect((await stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'day-old' })).id).toBe(first.id);
    clockMs += 2000; // now just past 24 h since the first request
    const later = await stripe.issuing.cards.create(cardParams(30_000), { idempotencyKey: 'day-old' });
    expect(later.id).not.toBe(first.id);
  });

  it('rejects keys longer than 255 characters', async () => {
    await expect(stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'k'.repeat(256) })).rejects.toMatchObject({
      statusCode: 400,
    });
    expect((await stripe.issuing.cards.create(cardParams(60_000), { idempotencyKey: 'k'.repeat(255) })).id).toMatch(/^ic_/);
  });

  it('ignores Idempotency-Key on GET, which is idempotent by definition', async () => {
    const list = await stripe.issuing.cards.list({}, { idempotencyKey: 'get-key' });
    expect(list.lastResponse.headers['idempotent-replayed']).toBeUndefined();
  });
});
