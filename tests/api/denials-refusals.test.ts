// Two outcomes beside the ordinary denial. A refusal of carriage for safety, security, health or conduct is not a
// denial of boarding and carries no compensation (SOR/2019-150 s.1(3) as we read it, from memory; 14 CFR 250.7 names
// the same grounds; Regulation 261/2004 Art. 2(j) excludes "reasonable grounds ... such as reasons of health, safety
// or security"). A denial recorded after the fact takes the amounts in force on the day it happened: 14 CFR 250.5 caps
// USD 775 / 1,550 from 13 Apr 2021 (86 FR 2534) and USD 1,075 / 2,150 from 22 Jan 2025 (89 FR 84815).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FlightEntity } from '../../server/src/db/entities';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO } from './helpers';
import { addBooking, addSingles, createFlight, removeDenialFixtures } from './denials-fixtures';

let t: TestApp;
let agent: Client;
let supervisor: Client;
let admin: Client;
let finance: Client;

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor, admin, finance] = await Promise.all([DEMO.agent, DEMO.supervisor, DEMO.admin, DEMO.finance].map((e) => signedIn(t, e)));
});
afterAll(async () => {
  await removeDenialFixtures(t.db);
  await t.close();
});

const audits = (action: string, entityId: number) =>
  t.db.query('SELECT actor_label, `after` FROM audit_log WHERE action = ? AND entity_id = ? ORDER BY id', [action, String(entityId)]);
const parsed = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v) as Record<string, unknown>;
const count = async (sql: string, args: unknown[]) => Number((await t.db.query(sql, args))[0].n);

describe('refusal of carriage for safety, security, health or conduct', () => {
  it('is recorded with its ground and reason, audited, takes the passenger off the flight, and is never a denial', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 2 });
    const [, , third] = await addSingles(t.db, flight, 3);
    const pid = third.passengers[0].id;
    const res = await agent.post(`/api/flights/${flight.id}/boarding-refusals`, { passengerIds: [pid], ground: 'conduct', reason: 'abusive to the gate staff, captain informed' }).expect(201);
    expect(res.body).toMatchObject({ passengerIds: [pid], ground: 'conduct', reason: 'abusive to the gate staff, captain informed', refusedBy: 'Alex Gatewood (demo agent)' });
    expect((await t.db.query('SELECT status FROM passengers WHERE id = ?', [pid]))[0].status).toBe('offloaded');
    expect(await count('SELECT COUNT(*) AS n FROM denials WHERE flight_id = ?', [flight.id])).toBe(0);
    expect(await count('SELECT COUNT(*) AS n FROM compensations WHERE flight_id = ?', [flight.id])).toBe(0);
    const [row] = await audits('boarding_refusal.recorded', res.body.id);
    expect(row.actor_label).toBe(DEMO.agent);
    expect(parsed(row.after)).toMatchObject({ ground: 'conduct', passengerIds: [pid] });
    // The shortfall the refused passenger made is gone, so no denial can be proposed for it.
    const counts = (await agent.get(`/api/flights/${flight.id}/denial-candidates`).expect(200)).body.counts;
    expect(counts.seatsShort).toBe(0);
    const list = (await supervisor.get(`/api/flights/${flight.id}/boarding-refusals`).expect(200)).body.refusals;
    expect(list.map((r: { id: number }) => r.id)).toEqual([res.body.id]);
  });

  it('an unknown ground or a missing reason is a 400 naming the field; nothing is stored', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 2 });
    const [one] = await addSingles(t.db, flight, 1);
    const pid = one.passengers[0].id;
    const ground = await agent.post(`/api/flights/${flight.id}/boarding-refusals`, { passengerIds: [pid], ground: 'overbooking', reason: 'no seat' }).expect(400);
    expect(ground.body.details[0]).toMatchObject({ field: 'ground' });
    const reason = await agent.post(`/api/flights/${flight.id}/boarding-refusals`, { passengerIds: [pid], ground: 'health' }).expect(400);
    expect(reason.body.details[0].field).toBe('reason');
    expect(await count('SELECT COUNT(*) AS n FROM boarding_refusals WHERE flight_id = ?', [flight.id])).toBe(0);
    await finance.post(`/api/flights/${flight.id}/boarding-refusals`, { passengerIds: [pid], ground: 'health', reason: 'unwell' }).expect(403);
  });

  it('a passenger already selected for denial is refused with 409 until that selection changes', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 1 });
    await addSingles(t.db, flight, 2);
    const p = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201)).body;
    const res = await agent.post(`/api/flights/${flight.id}/boarding-refusals`, { passengerIds: p.denials[0].passengerIds, ground: 'security', reason: 'security alert' }).expect(409);
    expect(res.body.error).toBe('in_denial');
  });
});

describe('a denial recorded after the fact', () => {
  // 23:30 in Boston on 21 Jan 2025 is already 22 Jan in UTC: the day of the denial is read in the station's zone.
  const departure = new Date('2025-01-22T04:30:00Z');
  const occurredAt = '2025-01-21T23:10:00-05:00';

  async function departedFlight(): Promise<{ flight: FlightEntity; pid: number; booked: number }> {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 30, departure });
    const { passengers } = await addBooking(t.db, flight, [{ first: 'Rita', last: 'Recorded', fareMinor: 70_000, checkedInBefore: 90 }]);
    const noShow = await addBooking(t.db, flight, [{ first: 'Ned', last: 'Noshow', status: 'booked' }]);
    return { flight, pid: passengers[0].id, booked: noShow.passengers[0].id };
  }

  it('a supervisor records it with its real time and a reason, audited; its date picks the caps in force that day', async () => {
    const { flight, pid } = await departedFlight();
    const res = await supervisor.post(`/api/flights/${flight.id}/denials/recorded`, { passengerIds: [pid], occurredAt, reason: 'denied at the gate, the record was never made' }).expect(201);
    expect(res.body).toMatchObject({ status: 'authorized', reason: 'Recorded after the fact: denied at the gate, the record was never made' });
    const denial = res.body.denials[0];
    expect(denial).toMatchObject({ status: 'authorized', authorizedAt: '2025-01-22T04:10:00.000Z', passengerIds: [pid] });
    const [row] = await audits('denial.recorded_after_fact', denial.id);
    expect(parsed(row.after)).toMatchObject({ occurredAt: '2025-01-22T04:10:00.000Z', deniedOn: '2025-01-21' });
    const rebooked = await agent.post(`/api/denials/${denial.id}/rebook`, { noAlternate: true }).expect(200);
    // 400% of USD 700.00 = 2,800.00, capped at USD 1,550.00 (86 FR 2534) on 21 Jan 2025, not the 2,150.00 of 89 FR 84815.
    expect(rebooked.body.denial.compensation.passengers[0]).toMatchObject({ amountMinor: 155_000, currency: 'USD', rulesInForce: { effectiveFrom: '2021-04-13' } });
  });

  it('only a supervisor records it (agent and admin 403); a future time, a time without offset or a no-show is a 400; nothing stored', async () => {
    const { flight, pid, booked } = await departedFlight();
    const body = { passengerIds: [pid], occurredAt, reason: 'correction' };
    await agent.post(`/api/flights/${flight.id}/denials/recorded`, body).expect(403);
    await admin.post(`/api/flights/${flight.id}/denials/recorded`, body).expect(403);
    const future = await supervisor.post(`/api/flights/${flight.id}/denials/recorded`, { ...body, occurredAt: new Date(Date.now() + 86_400_000).toISOString() }).expect(400);
    expect(future.body.details[0].field).toBe('occurredAt');
    const naive = await supervisor.post(`/api/flights/${flight.id}/denials/recorded`, { ...body, occurredAt: '2025-01-21 23:10' }).expect(400);
    expect(naive.body.details[0].field).toBe('occurredAt');
    const noShow = await supervisor.post(`/api/flights/${flight.id}/denials/recorded`, { ...body, passengerIds: [booked] }).expect(400);
    expect(noShow.body.message).toContain('a no-show, not a denied passenger');
    expect(await count('SELECT COUNT(*) AS n FROM denials WHERE flight_id = ?', [flight.id])).toBe(0);
  });
});
