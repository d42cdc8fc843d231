// Payment deadlines and the Canadian top-up. A denied passenger's compensation is created in the rule's default
// medium with its deadline; the deadline watch raises "due soon" and "overdue" alerts on a clock the test moves; paying
// resolves them. Sources: SOR/2019-150 s. 20 (pay within 48 h of the denial, top up when the real arrival falls in a
// higher band: the regulator's guide), amounts CAD 900 / 1,800 / 2,400 (s. 20(1), from memory).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity, CompensationEntity, StationEntity } from '../../server/src/db/entities';
import { recordCompensationDue } from '../../server/src/modules/compensations/compensation-due';
import { sweepPaymentDeadlines } from '../../server/src/modules/compensations/payment-deadlines';
import { signedIn, type Client } from './harness';
import { DEMO } from './helpers';
import { FIXTURE_SIGNATURE, insertCompensations, removeFlights, seedFlight, startFake, startPaymentsApp, type PaymentsApp, type RunningFake } from './payments-harness';

let fake: RunningFake;
let app: PaymentsApp;
let agent: Client;
let yul: StationEntity;
const flightIds: number[] = [];

beforeAll(async () => {
  fake = await startFake();
  app = await startPaymentsApp({ stripeApiUrl: fake.url, startWorker: false });
  yul = await app.db.getRepository(StationEntity).findOneByOrFail({ iata: 'YUL' });
  agent = await signedIn({ app: app.app } as Parameters<typeof signedIn>[0], DEMO.agent);
});

afterAll(async () => {
  await app.db.query('DELETE FROM alerts WHERE flight_id IN (?)', [flightIds.length ? flightIds : [0]]);
  await removeFlights(app.db, flightIds);
  await app.close();
  await fake.stop();
});

async function caDenial(): Promise<CompensationEntity> {
  const { flight, passengers } = await seedFlight(app.db, yul, { passengers: 1 });
  flightIds.push(flight.id);
  const [p] = passengers;
  return app.db.transaction((em) => recordCompensationDue(em, {
    stationId: yul.id, flightId: flight.id, bookingId: p.bookingId, passengerId: p.id, sourceKind: 'denial', sourceId: 2_100_000_000 - flight.id,
    regime: 'ca-appr', voluntary: false, amountMinor: 90_000, currency: 'CAD', band: 'ca-under-6h', ruleRef: 'SOR/2019-150 s. 20(1)', explanation: 'API test',
  }));
}

const alertsOf = async (id: number) => (await app.db.query('SELECT kind, resolved_at FROM alerts WHERE compensation_id = ? ORDER BY id', [id])) as { kind: string; resolved_at: Date | null }[];

describe('deadlines', () => {
  it('a Canadian denial is created in money (cash first) and due 48 h after the denial', async () => {
    const before = Date.now();
    const row = await caDenial();
    expect(row.medium).toBe('cash');
    expect(row.dueBy!.getTime() - before).toBeGreaterThanOrEqual(48 * 3_600_000 - 1_000);
    expect(row.dueBy!.getTime() - Date.now()).toBeLessThanOrEqual(48 * 3_600_000);
    expect(row.dueRuleRef).toBe('SOR/2019-150 s. 20');
  });

  it('alerts once when due soon, once when overdue, on a moved clock; paying resolves them', async () => {
    const row = await caDenial();
    const due = row.dueBy!.getTime();
    await sweepPaymentDeadlines(app.db, new Date(due - 3 * 3_600_000));
    expect(await alertsOf(row.id)).toEqual([]);
    await sweepPaymentDeadlines(app.db, new Date(due - 3_600_000));
    await sweepPaymentDeadlines(app.db, new Date(due - 1_800_000));
    expect((await alertsOf(row.id)).map((a) => a.kind)).toEqual(['payment-due-soon']);
    await sweepPaymentDeadlines(app.db, new Date(due + 60_000));
    await sweepPaymentDeadlines(app.db, new Date(due + 120_000));
    expect((await alertsOf(row.id)).map((a) => a.kind)).toEqual(['payment-due-soon', 'payment-overdue']);
    const desk = await agent.get(`/api/flights/${row.flightId}/compensations`).expect(200);
    expect(desk.body.compensations[0].payment.terms.dueBy).toBe(row.dueBy!.toISOString());

    await agent.post(`/api/compensations/${row.id}/counter-payment`, { medium: 'cash', drawerId: 'YUL-1', amountMinor: 90_000, signature: FIXTURE_SIGNATURE }).expect(200);
    expect((await alertsOf(row.id)).every((a) => a.resolved_at !== null)).toBe(true);
    await sweepPaymentDeadlines(app.db, new Date(due + 3_600_000));
    expect(await alertsOf(row.id)).toHaveLength(2);
  });

  it('a compensation without a deadline, or already paid, raises nothing', async () => {
    const { flight, passengers } = await seedFlight(app.db, yul, { passengers: 1 });
    flightIds.push(flight.id);
    const [row] = await insertCompensations(app.db, flight, passengers, () => ({ regime: 'eu-261', currency: 'EUR', voluntary: false, sourceKind: 'denial', dueBy: null }));
    await sweepPaymentDeadlines(app.db, new Date(Date.now() + 365 * 86_400_000));
    expect(await alertsOf(row.id)).toEqual([]);
  });
});

describe('the Canadian top-up from the real arrival', () => {
  it('a real arrival 7 h late after CAD 900 for under 6 h: a top-up of CAD 900 (1,800 − 900), due, audited', async () => {
    const base = await caDenial();
    const res = await agent.post(`/api/compensations/${base.id}/actual-arrival`, { arrivalDelayMinutes: 420 }).expect(200);
    expect(res.body.topUp).toMatchObject({ sourceKind: 'top-up', amountMinor: 90_000, currency: 'CAD', state: 'due', medium: 'cash' });
    expect(Date.parse(res.body.topUp.dueBy)).toBeGreaterThan(Date.now());
    // A shorter report changes nothing; a longer one moves the unpaid top-up to the higher band (2,400 − 900).
    await agent.post(`/api/compensations/${base.id}/actual-arrival`, { arrivalDelayMinutes: 300 }).expect(200);
    const later = await agent.post(`/api/compensations/${base.id}/actual-arrival`, { arrivalDelayMinutes: 600 }).expect(200);
    expect(later.body.topUp).toMatchObject({ id: res.body.topUp.id, amountMinor: 150_000 });
    expect(await app.db.getRepository(CompensationEntity).countBy({ sourceKind: 'top-up', sourceId: base.id })).toBe(1);
    const actions = (await app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(res.body.topUp.id) })).map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(['compensation.top_up_created', 'compensation.top_up_changed']));
  });

  it('no top-up when the band does not change; a bad delay names the field', async () => {
    const base = await caDenial();
    expect((await agent.post(`/api/compensations/${base.id}/actual-arrival`, { arrivalDelayMinutes: 200 }).expect(200)).body.topUp).toBeNull();
    const bad = await agent.post(`/api/compensations/${base.id}/actual-arrival`, { arrivalDelayMinutes: -5 }).expect(400);
    expect(bad.body.details[0].field).toBe('arrivalDelayMinutes');
  });
});
