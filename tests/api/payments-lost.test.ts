// A denial or a volunteer's agreement is a fact; a payment is an attempt to settle it. A payment voided by finance,
// canceled at the provider or refused by it leaves the passenger counted on the period report and owed in the
// ledger, raises an alert that the station and finance both see (kept until the passenger is paid), and can be
// re-issued from each of those states, never paying twice.
// Outside sources: BTS Form 251 lines 1(a), 3, 4, 5 and 8 (OMB No. 2138-0018; line 8 cash or check only, BTS
// instructions para. F, restated by DOT's Aviation Consumer Protection Division on 21 April 2006); Stripe docs
// "Issuing: cards" (status canceled cannot be undone; a canceled card cannot be spent) and "Idempotent requests".
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CompensationEntity, type FlightEntity, type StationEntity } from '../../server/src/db/entities';
import { raisePaymentLost } from '../../server/src/modules/alerts/alerts.service';
import { Client } from './harness';
import { DEMO, insertUser, removeRunUsers, TEST_PASSWORD } from './helpers';
import { insertCompensations, paymentsTestStation, removeFlights, seedFlight, startFake, startPaymentsApp, until, WEBHOOK_SECRET, type PaymentsApp, type RunningFake } from './payments-harness';

let fake: RunningFake;
let app: PaymentsApp;
let alb: StationEntity;
let agent: Client;
let finance: Client;
let elsewhere: Client;
let sdk: Stripe;
const flightIds: number[] = [];
const QUARTER = '2027-Q1';

async function client(role: 'agent' | 'finance', stationIds: number[]) {
  const user = await insertUser(app.db, { label: `lost-${role}`, role, stationIds });
  const c = new Client(app.app);
  await c.signIn(user.email, TEST_PASSWORD);
  return c;
}

beforeAll(async () => {
  fake = await startFake();
  app = await startPaymentsApp({ stripeApiUrl: fake.url, startWorker: false });
  fake.fake.webhooks.setEndpoint({ url: app.webhookUrl, secret: WEBHOOK_SECRET });
  // Albany, New York: a US airport no demo user belongs to; the quarter is this file's own.
  alb = await paymentsTestStation(app.db, 'ALB');
  const other = await paymentsTestStation(app.db, 'BGR');
  const stale: { id: number }[] = await app.db.query('SELECT id FROM flights WHERE station_id = ?', [alb.id]);
  await app.db.query('DELETE FROM denials WHERE station_id = ?', [alb.id]);
  await app.db.query('DELETE FROM denial_proposals WHERE station_id = ?', [alb.id]);
  await app.db.query('DELETE FROM alerts WHERE station_id = ?', [alb.id]);
  await removeFlights(app.db, stale.map((f) => f.id));
  agent = await client('agent', [alb.id]);
  finance = await client('finance', [alb.id]);
  elsewhere = await client('finance', [other.id]);
  sdk = new Stripe('sk_test_bumpboard_api_tests', { host: '127.0.0.1', port: fake.port, protocol: 'http', telemetry: false });
});

afterAll(async () => {
  await app.db.query('DELETE FROM denials WHERE station_id = ?', [alb.id]);
  await app.db.query('DELETE FROM alerts WHERE station_id = ?', [alb.id]);
  await removeFlights(app.db, flightIds);
  await removeRunUsers(app.db);
  await app.close();
  await fake.stop();
});

/** One passenger denied boarding on line 1(a) (an authorized denial record), owed `amountMinor`. */
async function deniedPassenger(amountMinor: number): Promise<{ flight: FlightEntity; comp: CompensationEntity }> {
  const { flight, passengers } = await seedFlight(app.db, alb, { passengers: 1, serviceDate: '2027-02-10' });
  flightIds.push(flight.id);
  const [comp] = await insertCompensations(app.db, flight, passengers, () => ({ voluntary: false, sourceKind: 'denial', band: 'us-200pct', amountMinor }));
  // A real proposal and supervisor behind the denial: the keys refuse a denial that points at nothing.
  const [{ id: supervisorId }] = await app.db.query('SELECT id FROM users WHERE email = ?', [DEMO.supervisor]);
  const proposal = await app.db.query(
    `INSERT INTO denial_proposals (flight_id, station_id, status, seats_needed, proposed_by_user_id, proposed_by_label, reason)
     VALUES (?, ?, 'authorized', 1, ?, 'API test', 'payments test')`,
    [flight.id, alb.id, supervisorId],
  );
  const result = await app.db.query(
    `INSERT INTO denials (proposal_id, flight_id, station_id, booking_id, passenger_ids, position, reasons, status, selected_by_user_id, category)
     VALUES (?, ?, ?, ?, ?, 1, '[]', 'authorized', ?, '1a')`,
    [proposal.insertId, flight.id, alb.id, comp.bookingId, JSON.stringify([comp.passengerId]), supervisorId],
  );
  await app.db.query('UPDATE compensations SET source_id = ? WHERE id = ?', [result.insertId, comp.id]);
  return { flight, comp };
}

async function volunteer(amountMinor: number) {
  const { flight, passengers } = await seedFlight(app.db, alb, { passengers: 1, serviceDate: '2027-02-11' });
  flightIds.push(flight.id);
  const [comp] = await insertCompensations(app.db, flight, passengers, () => ({ amountMinor }));
  return comp;
}

const cardsFor = (id: number) => [...fake.fake.store.state.cards.values()].filter((c) => c.metadata.compensationId === String(id));
const stateOf = async (id: number) => (await app.db.getRepository(CompensationEntity).findOneByOrFail({ id })).state;

async function report() {
  const res = await finance.get(`/api/finance/report?quarter=${QUARTER}&stationId=${alb.id}`).expect(200);
  return { body: res.body, line: Object.fromEntries(res.body.lines.map((l: { code: string }) => [l.code, l])) as Record<string, { count: number | null; amounts: { currency: string; amountMinor: number }[] | null }> };
}

async function openAlerts(c: Client, compensationId: number) {
  const res = await c.get(`/api/alerts?stationId=${alb.id}`).expect(200);
  return res.body.alerts.filter((a: { compensationId: number }) => a.compensationId === compensationId);
}

describe('a voided payment', () => {
  it('keeps the denied passenger on the report and owed, alerts station and finance, and re-issues once', async () => {
    const { comp } = await deniedPassenger(50_000);
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    await finance.post(`/api/compensations/${comp.id}/void`, { reason: 'Card sent to the wrong address' }).expect(200);

    const after = await report();
    // Still a denied passenger on line 1(a) and in the total; no longer among those paid (line 4) nor on line 8(a).
    expect(after.line['1a'].count).toBe(1);
    expect(after.line['3'].count).toBe(1);
    expect(after.line['4'].count).toBe(0);
    expect(after.line['8a'].amounts).toEqual([]);
    expect(after.line['x-owed'].amounts).toEqual([{ currency: 'USD', amountMinor: 50_000 }]);
    const ledger = await finance.get(`/api/finance/compensations?stationId=${alb.id}&from=2027-02-10&to=2027-02-10`).expect(200);
    expect(ledger.body.totals).toEqual([{ currency: 'USD', count: 1, amountMinor: 50_000, paidMinor: 0, owedMinor: 50_000, lostMinor: 50_000 }]);

    for (const who of [agent, finance]) {
      const alerts = await openAlerts(who, comp.id);
      expect(alerts).toHaveLength(1);
      expect(alerts[0]).toMatchObject({ kind: 'payment-voided', resolvedAt: null });
      expect(alerts[0].message).toMatch(/owed it again/);
    }

    // The desk re-issues: a new card under a fresh key; the first stays canceled; one live card, paid once.
    const res = await agent.post(`/api/compensations/${comp.id}/reissue`, { reason: 'Passenger at the desk, card re-sent' }).expect(200);
    expect(res.body.compensation.state).toBe('issued');
    expect((await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id })).idempotencyKey).toBe(`comp-${comp.id}-r2`);
    expect(cardsFor(comp.id).map((c) => c.status).sort()).toEqual(['active', 'canceled']);
    expect(await openAlerts(agent, comp.id)).toHaveLength(0);
    const paid = await report();
    expect(paid.line['4'].count).toBe(1);
    expect(paid.line['8a'].amounts).toEqual([{ currency: 'USD', amountMinor: 50_000 }]);
  });
});

describe('finance voids while the provider reports the cancellation it caused', () => {
  it('keeps one alert, in finance\'s words with its reason, whichever arrives first', async () => {
    const { comp } = await deniedPassenger(30_000);
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    const row = await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id });
    // The webhook of the cancellation lands first, then the void's own transaction records the loss.
    await app.db.transaction((em) => raisePaymentLost(em, row, 'payment-canceled', null));
    await app.db.transaction((em) => raisePaymentLost(em, row, 'payment-voided', 'Issued to the wrong passenger'));
    const alerts = await openAlerts(finance, comp.id);
    expect(alerts).toHaveLength(1);
    expect(alerts[0].kind).toBe('payment-voided');
    expect(alerts[0].message).toMatch(/Issued to the wrong passenger/);
  });
});

describe('the provider cancels a card', () => {
  it('marks the payment canceled (never a silent void), alerts, and re-issues only what was not spent', async () => {
    const comp = await volunteer(40_000);
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    const [first] = cardsFor(comp.id);
    fake.fake.settle(first.id, { amount: 15_000 });
    await until('the spend to reach the ledger', async () => (await stateOf(comp.id)) === 'settled', 10_000);
    await sdk.issuing.cards.update(first.id, { status: 'canceled' });
    await until('the cancellation to reach the ledger', async () => (await stateOf(comp.id)) === 'canceled', 10_000);

    const alerts = await openAlerts(finance, comp.id);
    expect(alerts.map((a: { kind: string }) => a.kind)).toEqual(['payment-canceled']);
    const owed = await report();
    expect(owed.line['5'].count).toBe(1);
    // derived: 400.00 owed − 150.00 the passenger spent before the cancellation = 250.00 still owed.
    expect(owed.line['x-owed'].amounts).toEqual([{ currency: 'USD', amountMinor: 25_000 }]);
    const ledger = await finance.get(`/api/finance/compensations?stationId=${alb.id}&from=2027-02-11&to=2027-02-11`).expect(200);
    expect(ledger.body.totals[0]).toMatchObject({ owedMinor: 25_000, lostMinor: 40_000 });

    await finance.post(`/api/compensations/${comp.id}/reissue`, { reason: 'Card canceled by the provider' }).expect(200);
    const live = cardsFor(comp.id).filter((c) => c.status === 'active');
    expect(live).toHaveLength(1);
    // derived: 400.00 owed − 150.00 already spent on the canceled card = 250.00 on the new one.
    expect(live[0].spending_limits).toEqual([{ amount: 25_000, interval: 'all_time', categories: null }]);
    await until('the new card to be recorded', async () => (await stateOf(comp.id)) === 'issued', 10_000);
    // A late event about the replaced card changes nothing.
    await sdk.issuing.cards.update(first.id, { metadata: { note: 'late news' } });
    await until('the late event to arrive', async () => Number((await app.db.query("SELECT COUNT(*) AS n FROM provider_events WHERE object_id = ? AND outcome LIKE 'ignored:%'", [first.id]))[0].n) > 0, 10_000);
    expect(await stateOf(comp.id)).toBe('issued');
  });
});

describe('a refused payment', () => {
  it('alerts and can be re-issued', async () => {
    const comp = await volunteer(30_000);
    await app.db.getRepository(CompensationEntity).update({ id: comp.id }, { currency: 'ZZZ' });
    expect((await agent.post(`/api/compensations/${comp.id}/issue`).expect(200)).body.compensation.state).toBe('failed');
    expect((await openAlerts(agent, comp.id)).map((a: { kind: string }) => a.kind)).toEqual(['payment-failed']);
    await app.db.getRepository(CompensationEntity).update({ id: comp.id }, { currency: 'USD' });
    expect((await finance.post(`/api/compensations/${comp.id}/reissue`, { reason: 'Currency corrected' }).expect(200)).body.compensation.state).toBe('issued');
    expect(await openAlerts(agent, comp.id)).toHaveLength(0);
  });
});

describe('acknowledging an alert', () => {
  it('records who is on it (audited), and keeps it listed until the passenger is paid', async () => {
    const comp = await volunteer(10_000);
    await finance.post(`/api/compensations/${comp.id}/void`, { reason: 'Wrong amount keyed' }).expect(200);
    const [alert] = await openAlerts(agent, comp.id);
    const acked = await agent.post(`/api/alerts/${alert.id}/acknowledge`).expect(200);
    expect(acked.body.alert.acknowledgedAt).not.toBeNull();
    expect(await openAlerts(finance, comp.id)).toHaveLength(1);
    const [{ n }] = await app.db.query("SELECT COUNT(*) AS n FROM audit_log WHERE action = 'alert.acknowledged' AND entity_id = ?", [String(alert.id)]);
    expect(Number(n)).toBe(1);
    await elsewhere.post(`/api/alerts/${alert.id}/acknowledge`).expect(404);
  });
});

describe('nothing is paid twice', () => {
  it('refuses to re-issue a payment that stands, or one whose card the provider still lists as usable', async () => {
    const comp = await volunteer(20_000);
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    expect((await finance.post(`/api/compensations/${comp.id}/reissue`, { reason: 'again' }).expect(409)).body.error).toBe('not_reissuable');
    // The ledger says voided, but the provider never heard of it: a new card would be a second payment.
    await app.db.getRepository(CompensationEntity).update({ id: comp.id }, { state: 'voided', voidReason: 'test' });
    expect((await finance.post(`/api/compensations/${comp.id}/reissue`, { reason: 'again' }).expect(409)).body.error).toBe('card_still_live');
    expect(cardsFor(comp.id)).toHaveLength(1);
  });
});

describe('alerts are scoped to the user’s stations', () => {
  it('answers 404 for another station and lists none of its alerts', async () => {
    await elsewhere.get(`/api/alerts?stationId=${alb.id}`).expect(404);
    const mine = await elsewhere.get('/api/alerts?status=all').expect(200);
    expect(mine.body.alerts.every((a: { stationId: number }) => a.stationId !== alb.id)).toBe(true);
    const bad = await finance.get('/api/alerts?status=closed').expect(400);
    expect(bad.body.details[0].field).toBe('status');
  });
});

describe('the period report', () => {
  it('draws its chart from the same items as its table: the days add up to the paid lines and the owed line', async () => {
    const { body, line } = await report();
    const sum = (k: 'voluntaryPaidMinor' | 'involuntaryPaidMinor' | 'owedMinor') => body.perDay.reduce((s: number, d: Record<string, number>) => s + d[k], 0);
    const total = (code: string) => (line[code].amounts ?? []).reduce((s, a) => s + a.amountMinor, 0);
    expect(body.perDay.length).toBeGreaterThan(0);
    expect(sum('voluntaryPaidMinor')).toBe(total('8c'));
    expect(sum('involuntaryPaidMinor')).toBe(total('8a') + total('8b'));
    expect(sum('owedMinor')).toBe(total('x-owed'));
  });
});
