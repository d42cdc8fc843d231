// POST /api/payments/webhook: signed events from the provider. The signature is checked on the raw body with the
// SDK's constructEvent (tolerance 300 s); each event id is stored once, so a replay is acknowledged and ignored;
// events only move a compensation forward, whatever order they come in.
// Outside sources: Stripe docs "Verify webhook signatures" (Stripe-Signature t=…,v1=HMAC-SHA256 of "t.payload",
// default tolerance five minutes), "Receive webhook events" (duplicates happen: log processed event ids; order is
// not guaranteed).
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CompensationEntity, ProviderEventEntity, StationEntity } from '../../server/src/db/entities';
import { signedIn } from './harness';
import { DEMO } from './helpers';
import { insertCompensations, removeFlights, seedFlight, startFake, startPaymentsApp, until, WEBHOOK_SECRET, webhooksSettled, type PaymentsApp, type RunningFake } from './payments-harness';

let fake: RunningFake;
let app: PaymentsApp;
let bos: StationEntity;
const flightIds: number[] = [];
const sdk = new Stripe('sk_test_signing_only', { telemetry: false });

beforeAll(async () => {
  fake = await startFake({ webhookRetry: { maxAttempts: 6, baseDelayMs: 50, maxDelayMs: 500 } });
  app = await startPaymentsApp({ stripeApiUrl: fake.url, startWorker: false });
  fake.fake.webhooks.setEndpoint({ url: app.webhookUrl, secret: WEBHOOK_SECRET });
  bos = await app.db.getRepository(StationEntity).findOneByOrFail({ iata: 'BOS' });
});

afterAll(async () => {
  await removeFlights(app.db, flightIds);
  await app.close();
  await fake.stop();
});

async function oneCompensation(state: Partial<CompensationEntity> = {}) {
  const { flight, passengers } = await seedFlight(app.db, bos, { passengers: 1 });
  flightIds.push(flight.id);
  const [row] = await insertCompensations(app.db, flight, passengers, () => state);
  return row;
}

function post(body: string, signature?: string) {
  const req = fetch(app.webhookUrl, { method: 'POST', headers: { 'Content-Type': 'application/json', ...(signature ? { 'Stripe-Signature': signature } : {}) }, body });
  return req.then(async (r) => ({ status: r.status, json: await r.json() }));
}

function cardEvent(id: string, type: string, card: Record<string, unknown>, created = Math.floor(Date.now() / 1000)) {
  return JSON.stringify({ id, object: 'event', type, created, api_version: '2026-10-28.endive', livemode: false, pending_webhooks: 1, request: { id: null, idempotency_key: null }, data: { object: card } });
}

const eventId = () => `evt_test_${Date.now()}_${Math.random().toString(36).slice(2)}`;
const card = (compensationId: number, over: Record<string, unknown> = {}) => ({
  id: `ic_test_${compensationId}`, object: 'issuing.card', cardholder: `ich_test_${compensationId}`, currency: 'usd', status: 'active', last4: '0042', exp_month: 11, exp_year: 2029,
  metadata: { compensationId: String(compensationId), stationId: String(bos.id) }, spending_controls: { spending_limits: [{ amount: 40_000, interval: 'all_time', categories: null }] }, ...over,
});
const sign = (payload: string, timestamp = Math.floor(Date.now() / 1000), secret = WEBHOOK_SECRET) => sdk.webhooks.generateTestHeaderString({ payload, secret, timestamp });

describe('signatures', () => {
  it('refuses an unsigned event', async () => {
    const res = await post(cardEvent(eventId(), 'issuing_card.created', card(1)));
    expect(res.status).toBe(400);
    expect(res.json.details[0].field).toBe('Stripe-Signature');
  });

  it('refuses a signature made with another secret, and a body changed after signing', async () => {
    const body = cardEvent(eventId(), 'issuing_card.created', card(1));
    expect((await post(body, sign(body, undefined, 'whsec_someone_else'))).status).toBe(400);
    expect((await post(body.replace('"active"', '"canceled"'), sign(body))).status).toBe(400);
  });

  it('refuses a correct signature older than five minutes', async () => {
    const body = cardEvent(eventId(), 'issuing_card.created', card(1));
    const res = await post(body, sign(body, Math.floor(Date.now() / 1000) - 301));
    expect(res.status).toBe(400);
    // Our rule names the age limit; the provider library's own sentence stays in the server log.
    expect(res.json.details).toEqual([{ field: 'Stripe-Signature', rule: 'must be a valid signature of this body, made within the last 300 seconds' }]);
    expect(res.json.message).not.toMatch(/tolerance/i);
  });

  it('stores nothing for a refused event', async () => {
    const id = eventId();
    const body = cardEvent(id, 'issuing_card.created', card(1));
    await post(body, sign(body, undefined, 'whsec_wrong'));
    expect(await app.db.getRepository(ProviderEventEntity).countBy({ eventId: id })).toBe(0);
  });
});

describe('duplicates and order', () => {
  it('applies an event once and acknowledges its replay without applying it again', async () => {
    const comp = await oneCompensation({ state: 'issuing', idempotencyKey: null });
    const id = eventId();
    const body = cardEvent(id, 'issuing_card.created', card(comp.id, { spending_controls: { spending_limits: [{ amount: comp.amountMinor, interval: 'all_time' }] } }));
    const first = await post(body, sign(body));
    expect(first).toMatchObject({ status: 200, json: { received: true, outcome: 'issued' } });
    // Finance voids it meanwhile; a replay of the old event must not bring the card back to life.
    await app.db.getRepository(CompensationEntity).update({ id: comp.id }, { state: 'voided', voidReason: 'test' });
    const replay = await post(body, sign(body));
    expect(replay).toMatchObject({ status: 200, json: { received: true, duplicate: true } });
    expect((await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id })).state).toBe('voided');
    expect(await app.db.getRepository(ProviderEventEntity).countBy({ eventId: id })).toBe(1);
  });

  it('never moves a compensation back when a cancellation arrives before the creation', async () => {
    const comp = await oneCompensation({ state: 'issuing' });
    const canceled = cardEvent(eventId(), 'issuing_card.updated', card(comp.id, { status: 'canceled' }), 2_000);
    const created = cardEvent(eventId(), 'issuing_card.created', card(comp.id), 1_000);
    // The provider's cancellation is its own state (never a silent void): the passenger is owed again.
    expect((await post(canceled, sign(canceled))).json.outcome).toBe('canceled');
    expect((await post(created, sign(created))).json.outcome).toMatch(/^ignored: already canceled/);
    expect((await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id })).state).toBe('canceled');
  });

  it('settles on a spend, and a late "card created" leaves it settled', async () => {
    const agent = await signedIn({ app: app.app } as Parameters<typeof signedIn>[0], DEMO.agent);
    const comp = await oneCompensation();
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    const row = await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id });
    fake.fake.settle(row.providerCardId!, { amount: 1_000 });
    await until('the spend to reach the ledger', async () => (await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id })).state === 'settled', 10_000);
    await until('the fake to finish sending', () => webhooksSettled(fake.fake), 10_000);
    const [{ spent }] = await app.db.query('SELECT spent_minor AS spent FROM provider_cards WHERE card_id = ?', [row.providerCardId]);
    expect(Number(spent)).toBe(1_000);
    const late = cardEvent(eventId(), 'issuing_card.created', card(comp.id, { id: row.providerCardId }));
    expect((await post(late, sign(late))).json.outcome).toMatch(/^ignored: already settled/);
  });

  it('learns the compensation from the card itself when a spend arrives before any news of the card', async () => {
    const comp = await oneCompensation({ state: 'issuing', idempotencyKey: null });
    await app.db.getRepository(CompensationEntity).update({ id: comp.id }, { idempotencyKey: `comp-${comp.id}` });
    // The card exists at the provider, but the ledger never heard back (the answer and its webhook were lost).
    fake.fake.webhooks.setEndpoint(null);
    await app.runtime.issuer.attempt(comp.id).catch(() => undefined);
    const cardId = [...fake.fake.store.state.cards.values()].find((c) => c.metadata.compensationId === String(comp.id))!.id;
    await app.db.getRepository(CompensationEntity).update({ id: comp.id }, { state: 'issuing', providerCardId: null });
    await app.db.query('DELETE FROM provider_cards WHERE card_id = ?', [cardId]);
    fake.fake.webhooks.setEndpoint({ url: app.webhookUrl, secret: WEBHOOK_SECRET });
    fake.fake.settle(cardId, { amount: 500 });
    await until('the spend to settle it', async () => (await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id })).state === 'settled', 10_000);
    expect((await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id })).providerCardId).toBe(cardId);
  });
});
