// The denial ranking through the API, and the station's priority rules.
// Outside sources: 14 CFR 250.3 (carriers set and publish boarding priority rules; they may not deny boarding to a
// passenger with a disability because of it, 14 CFR 382.19(c) / 382.93 (from memory)); 14 CFR 250.7 (a passenger who
// has boarded with a valid boarding pass is not removed for an oversale, from memory); Reg. (EC) 261/2004 Art. 11
// (priority for persons with reduced mobility, their companions and unaccompanied children); keeping families with
// children and parties together, and not denying the same ticket twice, are common practice.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { VolunteerEntity, VolunteerRoundEntity, DenialEntity, DenialProposalEntity } from '../../server/src/db/entities';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';
import { addBooking, createFlight, removeDenialFixtures, sessionUserOf } from './denials-fixtures';

let t: TestApp;
let agent: Client;
let admin: Client;
let finance: Client;
let flightId: number;
let bosId: number;
const ids: Record<string, number[]> = {};

beforeAll(async () => {
  t = await startTestApp();
  [agent, admin, finance] = await Promise.all([signedIn(t, DEMO.agent), signedIn(t, DEMO.admin), signedIn(t, DEMO.finance)]);
  bosId = await stationIdByIata(t.db, 'BOS');
  const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 6 });
  flightId = flight.id;
  const add = async (key: string, ...args: Parameters<typeof addBooking> extends [unknown, unknown, ...infer R] ? R : never) => {
    const { passengers } = await addBooking(t.db, flight, ...args);
    ids[key] = passengers.map((p) => p.id);
    return passengers;
  };
  await add('early', [{ first: 'Ada', last: 'Early', checkedInBefore: 180, fareMinor: 20_000 }]);
  await add('late', [{ first: 'Leo', last: 'Late', checkedInBefore: 40, fareMinor: 15_000 }]);
  await add('notCheckedIn', [{ first: 'Nia', last: 'Nocheck', status: 'booked', fareMinor: 30_000 }]);
  await add('umnr', [{ first: 'Uma', last: 'Minor', checkedInBefore: 70, ssr: ['UMNR'], isChild: true }]);
  await add('wheelchair', [{ first: 'Walt', last: 'Wheels', checkedInBefore: 66, ssr: ['WCHR'] }, { first: 'Cora', last: 'Wheels', checkedInBefore: 66 }]);
  await add('family', [{ first: 'Fay', last: 'Family', checkedInBefore: 64 }, { first: 'Kit', last: 'Family', checkedInBefore: 64, ssr: ['CHLD'], isChild: true }, { first: 'Ivo', last: 'Family', checkedInBefore: 64, ssr: ['INFT'], isChild: true }]);
  await add('boarded', [{ first: 'Bea', last: 'Boarded', status: 'boarded', checkedInBefore: 120 }]);
  await add('partyWithBoarded', [{ first: 'Pat', last: 'Pair', status: 'boarded', checkedInBefore: 62 }, { first: 'Sam', last: 'Pair', checkedInBefore: 62 }]);
  await add('volunteer', [{ first: 'Val', last: 'Volunteer', checkedInBefore: 60 }]);
  await add('cancelled', [{ first: 'Cal', last: 'Cancelled', status: 'cancelled' }]);
  // Check-in closes 30 min before departure (the default show-up profile): 10 min before is too late to be present.
  await add('lateCheckIn', [{ first: 'Lou', last: 'Latecomer', checkedInBefore: 10, fareMinor: 5_000 }]);

  // Denied once already: the same booking reference and name were denied (authorized) on an earlier flight.
  const earlier = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 6 });
  const deniedPnr = `DN${flightId.toString(36).toUpperCase().padStart(4, '0')}`.slice(0, 8);
  const before = await addBooking(t.db, earlier, [{ first: 'Dan', last: 'Denied', status: 'offloaded' }], { pnr: deniedPnr });
  const supervisor = await sessionUserOf(t.db, DEMO.supervisor);
  const proposal = await t.db.getRepository(DenialProposalEntity).save({ flightId: earlier.id, stationId: bosId, status: 'authorized', seatsNeeded: 1, proposedByUserId: supervisor.id, proposedByLabel: 'fixture', decidedByUserId: null, decidedAt: null, reason: 'fixture: denied on an earlier flight' });
  await t.db.getRepository(DenialEntity).save({ proposalId: proposal.id, flightId: earlier.id, stationId: bosId, bookingId: before.booking.id, passengerIds: before.passengers.map((p) => p.id), position: 1, reasons: [], status: 'authorized', selectedByUserId: supervisor.id, authorizedByUserId: supervisor.id, authorizedAt: new Date(), changeReason: null, category: null, compensation: null, statementMessageIds: null });
  await add('deniedBefore', [{ first: 'Dan', last: 'Denied', checkedInBefore: 58 }], { pnr: deniedPnr });

  const round = await t.db.getRepository(VolunteerRoundEntity).save({ flightId, stationId: bosId, kind: 'posted', status: 'open', currency: 'USD', offerMinor: 40_000, extras: [], volunteersNeeded: 1, openedByUserId: supervisor.id, openedByLabel: 'fixture', closedAt: null });
  await t.db.getRepository(VolunteerEntity).save({ roundId: round.id, flightId, bookingId: (await t.db.query('SELECT booking_id FROM passengers WHERE id = ?', [ids.volunteer[0]]))[0].booking_id, passengerIds: ids.volunteer, askMinor: null, source: 'agent', status: 'accepted', agreedMinor: 40_000, acceptedByUserId: supervisor.id, acceptedAt: new Date() });
});

afterAll(async () => {
  await removeDenialFixtures(t.db);
  await t.close();
});

describe('GET /api/flights/:flightId/denial-candidates', () => {
  it('ranks only the unprotected who are present, by the default rules: latest check-in first', async () => {
    const res = await agent.get(`/api/flights/${flightId}/denial-candidates`).expect(200);
    const order = res.body.candidates.map((c: { passengerIds: number[] }) => c.passengerIds);
    // Not checked in, or checked in after the deadline: not present, so never a denied passenger (a no-show).
    expect(order).toEqual([ids.late, ids.early]);
    expect(res.body.candidates[0].reasons.some((r: string) => r.startsWith('rule 1, check-in time: checked in'))).toBe(true);
    const set = (id: number) => res.body.excluded.find((e: { passengerId: number }) => e.passengerId === id);
    expect(set(ids.notCheckedIn[0])).toMatchObject({ protection: 'not-checked-in' });
    expect(set(ids.lateCheckIn[0])).toMatchObject({ protection: 'checked-in-late' });
    expect(set(ids.lateCheckIn[0]).reason).toContain('after the deadline');
    expect(res.body.rulesText[0]).toMatch(/volunteers/);
  });

  it('excludes every protected group with its protection', async () => {
    const res = await agent.get(`/api/flights/${flightId}/denial-candidates`).expect(200);
    const protectionOf = (id: number) => res.body.excluded.find((e: { passengerId: number }) => e.passengerId === id)?.protection;
    expect(protectionOf(ids.umnr[0])).toBe('unaccompanied-minor');
    expect(ids.wheelchair.map(protectionOf)).toEqual(['disability-or-companion', 'disability-or-companion']);
    expect(ids.family.map(protectionOf)).toEqual(['family-with-child', 'family-with-child', 'family-with-child']);
    expect(protectionOf(ids.boarded[0])).toBe('boarded');
    // 14 CFR 250.7 is quoted for a boarded passenger at a us-dot station.
    expect(res.body.excluded.find((e: { passengerId: number }) => e.passengerId === ids.boarded[0]).reason).toContain('14 CFR 250.7');
    expect(ids.partyWithBoarded.map(protectionOf)).toEqual(['boarded', 'kept-with-party']);
    expect(protectionOf(ids.volunteer[0])).toBe('volunteered');
    expect(protectionOf(ids.deniedBefore[0])).toBe('already-denied-on-ticket');
    const everyone = [...res.body.excluded.map((e: { passengerId: number }) => e.passengerId), ...res.body.candidates.flatMap((c: { passengerIds: number[] }) => c.passengerIds)];
    expect(everyone).not.toContain(ids.cancelled[0]);
  });

  it('counts the live shortfall: present (checked in by the deadline, or boarded), less accepted volunteers, minus seats', async () => {
    const res = await agent.get(`/api/flights/${flightId}/denial-candidates`).expect(200);
    // derived: 12 checked in (one of them after the deadline, so not present) and 2 boarded; 11 + 2 present, 1 of them
    // a volunteer: 12 occupying on 6 seats.
    expect(res.body.counts).toMatchObject({ seats: 6, boarded: 2, checkedIn: 12, acceptedVolunteerSeats: 1, occupying: 12, seatsShort: 6, waitingProposalSeats: 0, seatsShortAfterProposals: 6 });
    expect(res.body.counts.byCabin).toEqual([{ cabin: 'Y', seats: 6, occupying: 12, acceptedVolunteerSeats: 1, seatsShort: 6, waitingProposalSeats: 0, seatsShortAfterProposals: 6 }]);
  });

  it('refuses finance (403) and answers another station\'s flight as not found', async () => {
    await finance.get(`/api/flights/${flightId}/denial-candidates`).expect(403);
    await agent.get('/api/flights/999999999/denial-candidates').expect(404);
  });

  it('re-ranks when the station changes its rules: lowest fare first puts the 150.00 fare ahead', async () => {
    const before = (await admin.get(`/api/stations/${bosId}/priority-rules`).expect(200)).body;
    try {
      await admin.put(`/api/stations/${bosId}/priority-rules`, { rules: [{ factor: 'fare-paid', direction: 'lowest-first' }, { factor: 'check-in-time', direction: 'latest-first' }], tierOrder: ['silver', 'gold', 'platinum'] }).expect(200);
      const res = await agent.get(`/api/flights/${flightId}/denial-candidates`).expect(200);
      expect(res.body.candidates.map((c: { passengerIds: number[] }) => c.passengerIds)).toEqual([ids.late, ids.early]);
    } finally {
      await admin.put(`/api/stations/${bosId}/priority-rules`, { rules: before.rules, tierOrder: before.tierOrder }).expect(200);
    }
  });
});

describe('station priority rules', () => {
  it('an agent reads them; only an admin changes them (403 for the agent)', async () => {
    const res = await agent.get(`/api/stations/${bosId}/priority-rules`).expect(200);
    expect(res.body.rules.length).toBeGreaterThan(0);
    expect(res.body.description.some((l: string) => l.startsWith('1. '))).toBe(true);
    await agent.put(`/api/stations/${bosId}/priority-rules`, { rules: res.body.rules, tierOrder: res.body.tierOrder }).expect(403);
  });

  it('a bad rule list is a 400 naming the field and the rule', async () => {
    const twice = await admin.put(`/api/stations/${bosId}/priority-rules`, { rules: [{ factor: 'fare-paid', direction: 'lowest-first' }, { factor: 'fare-paid', direction: 'highest-first' }], tierOrder: [] }).expect(400);
    expect(twice.body.details[0]).toEqual({ field: 'rules.1.factor', rule: 'factor fare-paid is listed twice' });
    const empty = await admin.put(`/api/stations/${bosId}/priority-rules`, { rules: [], tierOrder: [] }).expect(400);
    expect(empty.body.details[0].field).toBe('rules');
  });

  it('a change writes an audit row with before and after', async () => {
    const current = (await admin.get(`/api/stations/${bosId}/priority-rules`).expect(200)).body;
    await admin.put(`/api/stations/${bosId}/priority-rules`, { rules: current.rules, tierOrder: current.tierOrder }).expect(200);
    const [row] = await t.db.query(`SELECT action, entity_id, \`before\`, \`after\` FROM audit_log WHERE action = 'priority_rules.updated' AND entity_id = ? ORDER BY id DESC LIMIT 1`, [String(bosId)]);
    expect(row.action).toBe('priority_rules.updated');
    const after = typeof row.after === 'string' ? JSON.parse(row.after) : row.after;
    expect(after.rules).toEqual(current.rules);
  });
});
