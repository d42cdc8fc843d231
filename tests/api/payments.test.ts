// Issuing compensation through the real stripe SDK against the payments stand-in (in-process, port 0): one
// cardholder and one virtual card per compensation, the amount as the card's all_time spending limit, keys derived
// from the compensation id, the receipt through the outbox; a credit offered in writing first; finance voids
// (card canceled at the provider) and re-issues a refused one.
// Outside sources: Stripe docs "Idempotent requests" (same key, same result), "Issuing: virtual cards" and
// "Spending controls" (spending_limits with interval all_time), the stripe-node 23.1 parameter docs (cardholder
// name at most 24 characters, no numbers or special characters); 14 CFR 250.5(c) and Reg. (EC) 261/2004 Art. 7(3)
// (a voucher only with the passenger's agreement) — the regulations from memory.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity, CompensationEntity, OutboxMessageEntity, StationEntity } from '../../server/src/db/entities';
import { signedIn, type Client } from './harness';
import { DEMO } from './helpers';
import { insertCompensations, removeFlights, seedFlight, startFake, startPaymentsApp, type PaymentsApp, type RunningFake } from './payments-harness';

let fake: RunningFake;
let app: PaymentsApp;
let agent: Client;
let finance: Client;
let supervisor: Client;
let bos: StationEntity;
const flightIds: number[] = [];

beforeAll(async () => {
  fake = await startFake();
  app = await startPaymentsApp({ stripeApiUrl: fake.url, startWorker: false });
  bos = await app.db.getRepository(StationEntity).findOneByOrFail({ iata: 'BOS' });
  const tc = { app: app.app } as Parameters<typeof signedIn>[0];
  agent = await signedIn(tc, DEMO.agent);
  finance = await signedIn(tc, DEMO.finance);
  supervisor = await signedIn(tc, DEMO.supervisor);
});

afterAll(async () => {
  await removeFlights(app.db, flightIds);
  await app.close();
  await fake.stop();
});

async function dueCompensations(n: number, station = bos, over: Parameters<typeof insertCompensations>[3] = () => ({})) {
  const { flight, passengers } = await seedFlight(app.db, station, { passengers: n });
  flightIds.push(flight.id);
  return { flight, rows: await insertCompensations(app.db, flight, passengers, over) };
}

const cardsFor = (id: number) => [...fake.fake.store.state.cards.values()].filter((c) => c.metadata.compensationId === String(id));

describe('an agent issues a compensation', () => {
  it('creates one cardholder and one virtual card whose all_time limit is the amount, and records it', async () => {
    const { flight, rows: [comp] } = await dueCompensations(1);
    const res = await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    expect(res.body.compensation).toMatchObject({ id: comp.id, state: 'issued', amountMinor: comp.amountMinor, currency: 'USD' });

    const [card] = cardsFor(comp.id);
    expect(cardsFor(comp.id)).toHaveLength(1);
    expect(card).toMatchObject({ currency: 'usd', type: 'virtual', status: 'active', metadata: { compensationId: String(comp.id), stationId: String(bos.id), flightId: String(flight.id) } });
    expect(card.spending_limits).toEqual([{ amount: comp.amountMinor, interval: 'all_time', categories: null }]);
    const holder = fake.fake.store.state.cardholders.get(card.cardholder)!;
    // The name is printed on the card: letters and spaces only, at most 24 characters (accents folded).
    expect(holder.name).toMatch(/^[A-Za-z ]{1,24}$/);

    const row = await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id });
    expect(row).toMatchObject({ state: 'issued', idempotencyKey: `comp-${comp.id}`, providerCardId: card.id, providerCardholderId: holder.id, lastError: null });
    const keys = [...fake.fake.store.state.idempotency.keys()];
    expect(keys).toEqual(expect.arrayContaining([`comp-${comp.id}-cardholder`, `comp-${comp.id}-card`]));

    const receipts = await app.db.getRepository(OutboxMessageEntity).findBy({ dedupeKey: `compensation-receipt:${comp.id}:${card.id}` });
    expect(receipts).toHaveLength(1);
    expect(receipts[0]).toMatchObject({ kind: 'compensation-receipt', passengerIds: [comp.passengerId] });
    expect(receipts[0].text).toContain(card.last4);
    const actions = (await app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(comp.id) })).map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(['compensation.issue_requested', 'compensation.issued']));
  });

  it('answers a second request with the same card and issues nothing more', async () => {
    const { rows: [comp] } = await dueCompensations(1);
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    const again = await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    expect(again.body.compensation.state).toBe('issued');
    expect(cardsFor(comp.id)).toHaveLength(1);
  });

  it('lists the flight’s compensations for the desk, with the voucher terms', async () => {
    const { flight, rows } = await dueCompensations(2);
    const res = await agent.get(`/api/flights/${flight.id}/compensations`).expect(200);
    expect(res.body.compensations.map((c: { id: number }) => c.id).sort()).toEqual(rows.map((r) => r.id).sort());
    expect(res.body.compensations[0].voucher).toMatchObject({ allowed: true, offeredAt: null, agreedAt: null });
    expect(res.body.compensations[0].voucher.restrictions.length).toBeGreaterThan(0);
  });

  it('refuses supervisors and finance at the desk routes: nobody else touches money', async () => {
    const { flight, rows: [comp] } = await dueCompensations(1);
    await supervisor.post(`/api/compensations/${comp.id}/issue`).expect(403);
    await finance.post(`/api/compensations/${comp.id}/issue`).expect(403);
    await supervisor.get(`/api/flights/${flight.id}/compensations`).expect(403);
    await agent.post(`/api/compensations/${comp.id}/void`, { reason: 'not allowed' }).expect(403);
    expect(cardsFor(comp.id)).toHaveLength(0);
  });
});

describe('a travel credit is offered in writing first', () => {
  // The agreement itself (text, signature, conditions) is covered in payment-media-agreements.test.ts.
  it('sends the offer with the cash amount and the restrictions', async () => {
    const { rows: [comp] } = await dueCompensations(1);
    const offer = await agent.post(`/api/compensations/${comp.id}/voucher-offer`).expect(200);
    // The amount as the notice prints it: ISO code, then the amount (Intl puts a no-break space between them).
    expect(offer.body.offer.text).toMatch(new RegExp(`USD\\s${(comp.amountMinor / 100).toFixed(2)}`));
    expect(offer.body.offer.restrictions.length).toBeGreaterThan(0);
    expect(offer.body.offer.sentTo).toMatch(/@example\.test$/);
    const sent = await app.db.getRepository(OutboxMessageEntity).findBy({ kind: 'voucher-offer', flightId: comp.flightId });
    expect(sent).toHaveLength(1);
  });

  it('writes the offer and the card receipt in the booking\'s language', async () => {
    const { rows: [comp] } = await dueCompensations(1);
    await app.db.query('UPDATE bookings b JOIN passengers p ON p.booking_id = b.id SET b.language = ? WHERE p.id = ?', ['es', comp.passengerId]);
    await agent.post(`/api/compensations/${comp.id}/voucher-offer`).expect(200);
    const [offer] = await app.db.getRepository(OutboxMessageEntity).findBy({ kind: 'voucher-offer', flightId: comp.flightId });
    expect(offer.subject).toMatch(/ en dinero, o un bono de viaje$/);
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    const [receipt] = await app.db.getRepository(OutboxMessageEntity).findBy({ kind: 'compensation-receipt', flightId: comp.flightId });
    expect(receipt.subject).toMatch(/^Su compensación por el vuelo /);
    expect(receipt.html).toContain('<html lang="es">');
  });
});

describe('finance voids and re-issues', () => {
  it('voids an issued compensation by canceling its card at the provider, with the reason', async () => {
    const { rows: [comp] } = await dueCompensations(1);
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    await finance.post(`/api/compensations/${comp.id}/void`, { reason: '' }).expect(400);
    const res = await finance.post(`/api/compensations/${comp.id}/void`, { reason: 'Issued to the wrong passenger' }).expect(200);
    expect(res.body.compensation).toMatchObject({ state: 'voided', voidReason: 'Issued to the wrong passenger' });
    expect(cardsFor(comp.id)[0].status).toBe('canceled');
    const again = await finance.post(`/api/compensations/${comp.id}/void`, { reason: 'twice' }).expect(409);
    expect(again.body.error).toBe('already_voided');
  });

  it('marks a compensation the provider refuses as failed with the reason, and re-issues it under a fresh key', async () => {
    const { rows: [comp] } = await dueCompensations(1, bos, () => ({ currency: 'ZZZ' }));
    const res = await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    expect(res.body.compensation.state).toBe('failed');
    expect(res.body.compensation.lastError).toMatch(/currency/);
    const blocked = await agent.post(`/api/compensations/${comp.id}/issue`).expect(409);
    expect(blocked.body.error).toBe('issue_failed');

    // The data is corrected (as finance would after reading the reason), then finance re-issues.
    await app.db.getRepository(CompensationEntity).update({ id: comp.id }, { currency: 'USD' });
    const reissued = await finance.post(`/api/compensations/${comp.id}/reissue`, { reason: 'Currency corrected to USD' }).expect(200);
    expect(reissued.body.compensation.state).toBe('issued');
    const row = await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id });
    expect(row.idempotencyKey).toBe(`comp-${comp.id}-r2`);
    expect(cardsFor(comp.id)).toHaveLength(1);
    // The cardholder made on the first attempt was reused, not made again.
    expect([...fake.fake.store.state.cardholders.values()].filter((h) => h.metadata.compensationId === String(comp.id))).toHaveLength(1);
  });

  it('re-issues only a compensation whose payment was lost (refused, voided or canceled)', async () => {
    const { rows: [comp] } = await dueCompensations(1);
    const res = await finance.post(`/api/compensations/${comp.id}/reissue`, { reason: 'try' }).expect(409);
    expect(res.body.error).toBe('not_reissuable');
  });
});

describe('the worker', () => {
  it('finishes issuances of its own provider account and leaves another account’s alone', async () => {
    const { rows: [ours, theirs] } = await dueCompensations(2);
    for (const row of [ours, theirs]) await app.db.getRepository(CompensationEntity).update({ id: row.id }, { state: 'issuing', idempotencyKey: `comp-${row.id}` });
    await app.db.query('INSERT INTO payment_issuances (compensation_id, provider_account, requested_at) VALUES (?, ?, NOW(3)), (?, ?, NOW(3))', [ours.id, app.runtime.ctx.providerAccount, theirs.id, 'ffffffffffffffff']);
    await app.runtime.worker.runOnce({ all: true });
    // Nor does an agent's "issue" on the desk push it through this server's account.
    await agent.post(`/api/compensations/${theirs.id}/issue`).expect(200);
    expect((await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: ours.id })).state).toBe('issued');
    // Started under another key or API URL: its idempotency keys mean nothing here, so retrying could pay twice.
    expect((await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: theirs.id })).state).toBe('issuing');
    expect(cardsFor(theirs.id)).toHaveLength(0);
  });
});
