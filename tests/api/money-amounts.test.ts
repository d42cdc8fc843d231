// Every money field of the API takes integer minor units only: a decimal, a typed string such as "275,50", a negative
// or an absurd amount is a 400 naming the field and the rule, and nothing is stored. The minor unit itself is the
// ISO 4217 one (USD 2 decimals, from memory of ISO 4217 list one).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity, type FlightEntity } from '../../server/src/db/entities';
import type { Client } from './harness';
import { signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';
import { makeFlight, removeFlights, settle } from './volunteers-fixtures';

let t: TestApp;
let agent: Client;
let admin: Client;
let flight: FlightEntity;
let bos: number;

beforeAll(async () => {
  t = await startTestApp();
  [agent, admin] = await Promise.all([DEMO.agent, DEMO.admin].map((e) => signedIn(t, e)));
  bos = await stationIdByIata(t.db, 'BOS');
  flight = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'PWM' });
});

afterAll(async () => {
  await settle(t);
  await removeFlights(t.db, [flight.id]);
  await t.close();
});

const audits = () => t.db.getRepository(AuditLogEntity).count();

describe('money fields take integer minor units only', () => {
  it.each([
    [275.5, 'offerMinor must be a whole number of minor units (e.g. cents)'],
    ['275,50', 'offerMinor must be a number of minor units, not text'],
    [-100, 'offerMinor must not be negative'],
    [5_000_000_000, 'offerMinor must be at most 1000000000 minor units'],
  ])('opening a round with offerMinor %j is a 400: %s, and nothing is stored', async (offerMinor, rule) => {
    const before = await audits();
    const res = await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor, volunteersNeeded: 1 });
    expect(res.status).toBe(400);
    expect(res.body.details).toContainEqual({ field: 'offerMinor', rule });
    expect((await agent.get(`/api/flights/${flight.id}/rounds`).expect(200)).body.rounds).toHaveLength(0);
    expect(await audits()).toBe(before);
  });

  it('refuses a ladder step in decimals, naming the step', async () => {
    const current = (await admin.get(`/api/stations/${bos}/volunteer-policy`).expect(200)).body;
    const res = await admin.put(`/api/stations/${bos}/volunteer-policy`, { ...current, ladderMinor: [20_000, 27_550.5] });
    expect(res.status).toBe(400);
    expect(res.body.details).toContainEqual({ field: 'ladderMinor.1', rule: 'ladderMinor[] must be a whole number of minor units (e.g. cents)' });
    expect((await admin.get(`/api/stations/${bos}/volunteer-policy`).expect(200)).body).toEqual(current);
  });
});
