import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import binomialPmf from '@stdlib/stats-base-dists-binomial-pmf';
import { AuditLogEntity } from '../../server/src/db/entities';
import { SavedPlanEntity } from '../../server/src/db/entities/saved-plan.entity';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, RUN_ID, foreignStation, stationIdByIata } from './helpers';

let t: TestApp;
let supervisor: Client;
let admin: Client;
let bos: number;
let fco: number;
let tos: number;

// A flight designator unique to this run, so the list for its route key holds only this run's plans.
const designator = `ZZ${String(Date.now() % 10_000).padStart(4, '0')}`;
const routeKey = `BOS-ORD/${designator}/2031-06-01`;
const named = (label: string) => `API ${label} ${RUN_ID}`;

// Team 180, "Optimal Overbooking", MCM 2002 (The UMAP Journal 23(3), 2002), Table 1: capacity C = 150,
// show probability p = 0.90, a bumped passenger costs (k + 1) times the fare: k = 1 -> 167, k = 2 -> 165.
const mcm = { capacity: 150, showProbability: 0.9, revenuePerBookingMinor: 20_000, costPerDenialMinor: 40_000, currency: 'USD' };

/** R(n) = r n - h E[(X_n - C)+] with X_n ~ Binomial(n, p), summed with the stdlib binomial pmf (reference library). */
function expectedNetMinor(n: number, c: number, p: number, r: number, h: number): number {
  let denied = 0;
  for (let k = c + 1; k <= n; k++) denied += (k - c) * binomialPmf(k, n, p);
  return r * n - h * denied;
}

beforeAll(async () => {
  t = await startTestApp();
  [supervisor, admin] = await Promise.all([signedIn(t, DEMO.supervisor), signedIn(t, DEMO.admin)]);
  bos = await stationIdByIata(t.db, 'BOS');
  fco = await stationIdByIata(t.db, 'FCO');
  tos = (await foreignStation(t.db)).id;
});

afterAll(async () => {
  await t.db.query('DELETE FROM saved_plans WHERE name LIKE ?', [`%${RUN_ID}%`]);
  await t.close();
});

const storedNamed = (name: string) => t.db.getRepository(SavedPlanEntity).countBy({ name });

describe('saving and listing plans', () => {
  it('saves a plan with the optimum computed on the server, audits it, and lists it newest first with who saved it', async () => {
    const first = await supervisor.post('/api/plans', { stationId: bos, routeKey, name: named('fare x2'), inputs: mcm }).expect(201);
    expect(first.body).toMatchObject({ stationId: bos, routeKey, name: named('fare x2'), inputs: mcm, createdBy: { displayName: expect.any(String) } });
    // Team 180 Table 1, p = 0.90, k = 1 (cost 2 x fare): 167 bookings
    expect(first.body.result.bookings).toBe(167);
    // derived: R(167) summed independently with the stdlib pmf, rounded to whole cents
    expect(Math.abs(first.body.result.expectedNetMinor - expectedNetMinor(167, 150, 0.9, 20_000, 40_000))).toBeLessThanOrEqual(0.5);
    expect(Number.isInteger(first.body.result.expectedNetMinor)).toBe(true);

    const second = await admin.post('/api/plans', { stationId: bos, routeKey, name: named('fare x3'), inputs: { ...mcm, costPerDenialMinor: 60_000 } }).expect(201);
    // Team 180 Table 1, p = 0.90, k = 2 (cost 3 x fare): 165 bookings
    expect(second.body.result.bookings).toBe(165);

    const list = await supervisor.get(`/api/plans?stationId=${bos}&routeKey=${encodeURIComponent(routeKey)}`).expect(200);
    expect(list.body.plans.map((p: { name: string }) => p.name)).toEqual([named('fare x3'), named('fare x2')]);
    const [latest] = list.body.plans;
    expect(latest.createdBy.displayName).toBe(second.body.createdBy.displayName);
    expect(new Date(latest.createdAt).toISOString()).toBe(latest.createdAt);

    const auditRow = await t.db.getRepository(AuditLogEntity).findOneByOrFail({ entityType: 'saved_plan', entityId: String(first.body.id) });
    expect(auditRow).toMatchObject({ action: 'plan.saved', actorLabel: DEMO.supervisor, stationId: bos });
  });

  it('keeps the optional show-up correlation and a route without a flight', async () => {
    const res = await supervisor.post('/api/plans', { stationId: bos, routeKey: 'BOS-ORD', name: named('correlated'), inputs: { ...mcm, rho: 0.02 } }).expect(201);
    expect(res.body.inputs.rho).toBe(0.02);
    // derived: correlated show-ups fatten the oversale tail, so the optimum cannot lie above the independent one (167)
    expect(res.body.result.bookings).toBeLessThanOrEqual(167);
  });

  it('lists nothing for a route without plans', async () => {
    const res = await supervisor.get(`/api/plans?stationId=${fco}&routeKey=FCO-ZRH/ZZ0001/2031-01-01`).expect(200);
    expect(res.body.plans).toEqual([]);
  });
});

describe('bad input', () => {
  const cases: [string, Record<string, unknown>, string, string][] = [
    ['a show rate above 1', { inputs: { ...mcm, showProbability: 1.5 } }, 'inputs.showProbability', 'showProbability must be at most 1'],
    ['cents with decimals', { inputs: { ...mcm, revenuePerBookingMinor: 199.5 } }, 'inputs.revenuePerBookingMinor', 'revenuePerBookingMinor must be a whole number of minor units (e.g. cents)'],
    ['no name', { name: '   ' }, 'name', 'name is required'],
    ['a route key of neither form', { routeKey: 'BOSTON' }, 'routeKey', 'routeKey must be a route such as BOS-ORD or a flight such as BOS-ORD/BB123/2026-06-01'],
    ['a flight date that does not exist', { routeKey: 'BOS-ORD/BB12/2031-02-30' }, 'routeKey', 'routeKey must carry a real calendar date (YYYY-MM-DD)'],
    ['a route from another airport', { routeKey: 'FCO-ORD' }, 'routeKey', "routeKey must start at this station's airport (BOS)"],
    ['an unknown field', { overbook: true }, 'body', 'Unrecognized key: "overbook"'],
  ];

  it.each(cases)('refuses %s with 400 naming the field, and stores nothing', async (label, change, field, rule) => {
    const name = named(`bad ${label}`);
    const res = await supervisor.post('/api/plans', { stationId: bos, routeKey, name, inputs: mcm, ...change }).expect(400);
    expect(res.body.error).toBe('invalid_request');
    expect(res.body.details).toContainEqual({ field, rule });
    expect(await storedNamed(name)).toBe(0);
  });

  it('refuses a list without a route key', async () => {
    const res = await supervisor.get(`/api/plans?stationId=${bos}`).expect(400);
    expect(res.body.details).toContainEqual({ field: 'routeKey', rule: 'routeKey is required' });
  });
});

describe('who may plan', () => {
  it.each([
    ['agent', DEMO.agent],
    ['finance', DEMO.finance],
  ])('refuses the %s role with 403, reading or saving', async (label, email) => {
    const c = await signedIn(t, email);
    await c.get(`/api/plans?stationId=${bos}&routeKey=BOS-ORD`).expect(403);
    const name = named(`by ${label}`);
    await c.post('/api/plans', { stationId: bos, routeKey, name, inputs: mcm }).expect(403);
    expect(await storedNamed(name)).toBe(0);
  });

  it('answers 401 without a session', async () => {
    const anonymous = new Client(t.app);
    await anonymous.refreshCsrf();
    await anonymous.get(`/api/plans?stationId=${bos}&routeKey=BOS-ORD`).expect(401);
    await anonymous.post('/api/plans', { stationId: bos, routeKey, name: named('anonymous'), inputs: mcm }).expect(401);
    expect(await storedNamed(named('anonymous'))).toBe(0);
  });

  it('answers 404 for a station the user does not belong to, or one that does not exist', async () => {
    for (const stationId of [tos, 99_999_999]) {
      await supervisor.get(`/api/plans?stationId=${stationId}&routeKey=TOS-OSL`).expect(404);
      const name = named(`station ${stationId}`);
      const res = await supervisor.post('/api/plans', { stationId, routeKey: 'TOS-OSL', name, inputs: mcm }).expect(404);
      expect(res.body.error).toBe('not_found');
      expect(await storedNamed(name)).toBe(0);
    }
  });
});
