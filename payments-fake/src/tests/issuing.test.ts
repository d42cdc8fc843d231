import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { createPassengerCard, PASSENGER, startFake, type RunningFake } from './harness.js';

let running: RunningFake;
let stripe: Stripe;

beforeAll(async () => {
  running = await startFake();
  stripe = running.stripe;
});
afterAll(async () => {
  await running.stop();
});
beforeEach(() => {
  running.fake.reset();
});

describe('Issuing cardholders and cards through stripe-node 23.1', () => {
  it('creates a cardholder and a virtual card with an all_time spending limit, Stripe-shaped', async () => {
    const { cardholder, card } = await createPassengerCard(stripe, 60_000);
    // Object names and id prefixes as in Stripe's Issuing objects (stripe-node 23.1 types: 'issuing.cardholder', 'issuing.card';
    // ich_/ic_ prefixes from memory of Stripe's API reference examples).
    expect(cardholder.object).toBe('issuing.cardholder');
    expect(cardholder.id).toMatch(/^ich_/);
    expect(cardholder.metadata).toEqual(PASSENGER.metadata);
    expect(card.object).toBe('issuing.card');
    expect(card.id).toMatch(/^ic_/);
    expect(card.livemode).toBe(false);
    expect(card.currency).toBe('eur');
    expect(card.type).toBe('virtual');
    expect(card.status).toBe('active');
    expect(Number.isInteger(card.created)).toBe(true);
    expect(Math.abs(card.created - Date.now() / 1000)).toBeLessThan(60); // unix seconds, not ms (Stripe API reference)
    // The card embeds its cardholder in full (stripe-node 23.1: `cardholder: Cardholder`).
    expect(card.cardholder.id).toBe(cardholder.id);
    expect(card.spending_controls.spending_limits).toEqual([{ amount: 60_000, categories: null, interval: 'all_time' }]);
    expect(card.spending_controls.spending_limits_currency).toBe('eur');
    expect(card.metadata).toEqual({ caseId: 'case-001' });
    expect(card.last4).toMatch(/^\d{4}$/);
  });

  it('lowercases an upper-case currency and defaults a new card to inactive', async () => {
    const cardholder = await stripe.issuing.cardholders.create(PASSENGER);
    const card = await stripe.issuing.cards.create({ cardholder: cardholder.id, currency: 'USD', type: 'virtual' });
    expect(card.currency).toBe('usd'); // Stripe returns lowercase ISO codes (API reference "currency")
    expect(card.status).toBe('inactive'); // stripe-node 23.1 CardCreateParams.status: "Defaults to `inactive`"
  });

  it('retrieves cards and cardholders, and voids a card by setting status canceled with metadata', async () => {
    const { cardholder, card } = await createPassengerCard(stripe, 25_000);
    expect((await stripe.issuing.cardholders.retrieve(cardholder.id)).name).toBe('Ana Lima');
    const voided = await stripe.issuing.cards.update(card.id, { status: 'canceled', metadata: { voidReason: 'rebooked' } });
    expect(voided.status).toBe('canceled');
    expect(voided.metadata).toEqual({ caseId: 'case-001', voidReason: 'rebooked' }); // metadata merges (docs.stripe.com/metadata)
    expect((await stripe.issuing.cards.retrieve(card.id)).status).toBe('canceled');

    const events = await stripe.events.list({ type: 'issuing_card.updated' });
    expect(events.data).toHaveLength(1);
    const [updated] = events.data;
    expect(updated.data.previous_attributes).toMatchObject({ status: 'active', metadata: { voidReason: '' } });
    expect((updated.data.object as { id: string }).id).toBe(card.id);
  });

  it('refuses to reactivate a canceled card, naming the param', async () => {
    const { card } = await createPassengerCard(stripe, 10_000);
    await stripe.issuing.cards.update(card.id, { status: 'canceled' });
    await expect(stripe.issuing.cards.update(card.id, { status: 'active' })).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      param: 'status',
    });
  });

  it('removes a metadata key when updated with an empty value (docs.stripe.com/metadata)', async () => {
    const { card } = await createPassengerCard(stripe, 10_000);
    const updated = await stripe.issuing.cards.update(card.id, { metadata: { caseId: '' } });
    expect(updated.metadata).toEqual({});
  });

  it('records issuing_cardholder.created and issuing_card.created events, retrievable by id', async () => {
    const { card } = await createPassengerCard(stripe, 10_000);
    const events = await stripe.events.list({ limit: 10 });
    expect(events.data.map((event) => event.type)).toEqual(['issuing_card.created', 'issuing_cardholder.created']);
    const created = await stripe.events.retrieve(events.data[0].id);
    expect(created.id).toMatch(/^evt_/);
    expect(created.livemode).toBe(false);
    expect((created.data.object as { id: string }).id).toBe(card.id);
    expect(created.request?.idempotency_key).toMatch(/^stripe-node-retry-/); // the SDK keys every POST (RequestSender.js)
    const wildcard = await stripe.events.list({ type: 'issuing_card.*' });
    expect(wildcard.data).toHaveLength(1);
  });
});

describe('list pagination (docs.stripe.com/api/pagination)', () => {
  it('pages newest first with limit, has_more and starting_after / ending_before', async () => {
    const cardholder = await stripe.issuing.cardholders.create(PASSENGER);
    const ids: string[] = [];
    for (let i = 0; i < 5; i += 1) {
      const card = await stripe.issuing.cards.create({ cardholder: cardholder.id, currency: 'eur', type: 'virtual', metadata: { n: String(i) } });
      ids.push(card.id);
    }
    const newest = [...ids].reverse();
    const first = await stripe.issuing.cards.list({ limit: 2 });
    expect(first.object).toBe('list');
    expect(first.url).toBe('/v1/issuing/cards');
    expect(first.data.map((c) => c.id)).toEqual(newest.slice(0, 2));
    expect(first.has_more).toBe(true);
    const second = await stripe.issuing.cards.list({ limit: 2, starting_after: first.data[1].id });
    expect(second.data.map((c) => c.id)).toEqual(newest.slice(2, 4));
    expect(second.has_more).toBe(true);
    const last = await stripe.issuing.cards.list({ limit: 2, starting_after: second.data[1].id });
    expect(last.data.map((c) => c.id)).toEqual(newest.slice(4));
    expect(last.has_more).toBe(false);
    const back = await stripe.issuing.cards.list({ limit: 2, ending_before: last.data[0].id });
    expect(back.data.map((c) => c.id)).toEqual(newest.slice(2, 4));

    const all: string[] = [];
    for await (const card of stripe.issuing.cards.list({ limit: 2 })) all.push(card.id);
    expect(all).toEqual(newest); // the SDK's auto-pagination follows starting_after until has_more is false
  });

  it('filters by cardholder, status and created', async () => {
    const a = await createPassengerCard(stripe, 1_000);
    const b = await createPassengerCard(stripe, 2_000);
    await stripe.issuing.cards.update(b.card.id, { status: 'canceled' });
    const byHolder = await stripe.issuing.cards.list({ cardholder: a.cardholder.id });
    expect(byHolder.data.map((c) => c.id)).toEqual([a.card.id]);
    const canceled = await stripe.issuing.cards.list({ status: 'canceled' });
    expect(canceled.data.map((c) => c.id)).toEqual([b.card.id]);
    const future = await stripe.issuing.cards.list({ created: { gt: Math.floor(Date.now() / 1000) + 3600 } });
    expect(future.data).toEqual([]);
    const recent = await stripe.issuing.cards.list({ created: { gte: a.card.created } });
    expect(recent.data).toHaveLength(2);
  });

  it('rejects limit outside 1..100, naming the param', async () => {
    await expect(stripe.issuing.cards.list({ limit: 101 })).rejects.toMatchObject({ statusCode: 400, param: 'limit' });
  });
});
