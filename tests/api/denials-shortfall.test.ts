// A denial only when needed, and only of people who are there. Outside sources: 14 CFR 250.2a (a carrier denies boarding
// involuntarily only when a flight is oversold, from memory); 14 CFR 250.6(a) and BTS Form 251 line 2(c) (a passenger
// who did not meet the check-in deadline is not owed compensation: not a denied passenger, from memory); Regulation
// (EC) 261/2004 Art. 3(2)(a) (only passengers who presented themselves for check-in as stipulated). Counts are derived
// by hand beside each case.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FlightEntity } from '../../server/src/db/entities';
import { VolunteerEntity, VolunteerRoundEntity } from '../../server/src/db/entities';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, TEST_PASSWORD, insertUser, removeRunUsers } from './helpers';
import { addBooking, addSingles, createFlight, removeDenialFixtures, sessionUserOf } from './denials-fixtures';

let t: TestApp;
let agent: Client;
let supervisor: Client;

beforeAll(async () => {
  t = await startTestApp();
  [agent] = await Promise.all([signedIn(t, DEMO.agent)]);
  const [bos] = await t.db.query(`SELECT id FROM stations WHERE iata = 'BOS'`);
  // The agent proposes, so any supervisor of the station may authorize; a run user keeps the demo one free.
  const user = await insertUser(t.db, { label: 'shortfall-supervisor', role: 'supervisor', stationIds: [bos.id] });
  supervisor = new Client(t.app);
  expect((await supervisor.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
});
afterAll(async () => {
  await removeDenialFixtures(t.db);
  await removeRunUsers(t.db);
  await t.close();
});

const propose = (flight: FlightEntity, body: Record<string, unknown> = {}) =>
  agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'short at the gate', ...body });
const proposalsOn = async (flight: FlightEntity) => Number((await t.db.query('SELECT COUNT(*) AS n FROM denial_proposals WHERE flight_id = ?', [flight.id]))[0].n);

describe('a proposal needs a real shortfall', () => {
  it('a full flight with nobody short: 409 no_shortfall, nothing stored', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 2 });
    await addSingles(t.db, flight, 2);
    const res = await propose(flight).expect(409);
    expect(res.body.error).toBe('no_shortfall');
    expect(res.body.message).toContain('cabin Y: 2 present and eligible after 0 accepted volunteers, on 2 seats');
    expect(await proposalsOn(flight)).toBe(0);
  });

  it('passengers not checked in, or checked in after the deadline, do not make a shortfall', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 2 });
    await addSingles(t.db, flight, 2);
    await addBooking(t.db, flight, [{ first: 'Nell', last: 'Noshow', status: 'booked' }]);
    // Check-in closes 30 min before departure (the default show-up profile): 5 min before is late.
    await addBooking(t.db, flight, [{ first: 'Lars', last: 'Lately', checkedInBefore: 5 }]);
    const counts = (await agent.get(`/api/flights/${flight.id}/denial-candidates`).expect(200)).body.counts;
    expect(counts).toMatchObject({ checkedIn: 3, occupying: 2, seatsShort: 0 });
    expect((await propose(flight).expect(409)).body.error).toBe('no_shortfall');
    expect(await proposalsOn(flight)).toBe(0);
  });

  it('accepted volunteers close the gap: 3 present on 2 seats with 1 accepted volunteer is not short', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 2 });
    const [first] = await addSingles(t.db, flight, 3);
    const by = await sessionUserOf(t.db, DEMO.supervisor);
    const round = await t.db.getRepository(VolunteerRoundEntity).save({ flightId: flight.id, stationId: flight.stationId, kind: 'posted', status: 'open', currency: 'USD', offerMinor: 30_000, extras: [], volunteersNeeded: 1, openedByUserId: by.id, openedByLabel: 'fixture', closedAt: null });
    await t.db.getRepository(VolunteerEntity).save({ roundId: round.id, flightId: flight.id, bookingId: first.booking.id, passengerIds: first.passengers.map((p) => p.id), askMinor: null, source: 'agent', status: 'accepted', agreedMinor: 30_000, acceptedByUserId: by.id, acceptedAt: new Date() });
    expect((await propose(flight).expect(409)).body.error).toBe('no_shortfall');
  });

  it('more seats than are short is a 400 naming seatsNeeded', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 2 });
    await addSingles(t.db, flight, 3);
    const res = await propose(flight, { seatsNeeded: 2 }).expect(400);
    expect(res.body.details[0]).toEqual({ field: 'seatsNeeded', rule: 'must not exceed the seats short in cabin Y (1)' });
    expect(await proposalsOn(flight)).toBe(0);
  });

  it('a shortfall is per cabin: business short does not let economy passengers be denied', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', cabins: { J: 1, Y: 3 } });
    await addBooking(t.db, flight, [{ first: 'Jo', last: 'Front', cabin: 'J', checkedInBefore: 120 }]);
    const lateJ = await addBooking(t.db, flight, [{ first: 'Jay', last: 'Front', cabin: 'J', checkedInBefore: 100 }]);
    await addSingles(t.db, flight, 2); // economy: 2 present on 3 seats, checked in later than both J passengers
    const counts = (await agent.get(`/api/flights/${flight.id}/denial-candidates`).expect(200)).body.counts;
    expect(counts.byCabin.map((c: { cabin: string; seatsShort: number }) => [c.cabin, c.seatsShort])).toEqual([['J', 1], ['Y', 0]]);
    expect((await propose(flight, { cabin: 'Y' }).expect(409)).body.error).toBe('no_shortfall');
    expect((await propose(flight, { cabin: 'F' }).expect(400)).body.details[0].field).toBe('cabin');
    const res = await propose(flight).expect(201);
    expect(res.body.denials.map((d: { passengerIds: number[] }) => d.passengerIds)).toEqual([lateJ.passengers.map((p) => p.id)]);
  });
});

describe('authorizing checks the same facts again', () => {
  it('a shortfall that closed since the proposal (a passenger cancelled) is refused with 409; the denial stays waiting', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 2 });
    const singles = await addSingles(t.db, flight, 3);
    const p = (await propose(flight).expect(201)).body;
    const other = singles.find((s) => s.passengers[0].id !== p.denials[0].passengerIds[0])!;
    await t.db.query(`UPDATE passengers SET status = 'cancelled' WHERE id = ?`, [other.passengers[0].id]);
    const res = await supervisor.post(`/api/denial-proposals/${p.id}/authorize`).expect(409);
    expect(res.body.error).toBe('no_shortfall');
    const [{ status }] = await t.db.query('SELECT status FROM denials WHERE id = ?', [p.denials[0].id]);
    expect(status).toBe('proposed');
    const [{ pstatus }] = await t.db.query('SELECT status AS pstatus FROM passengers WHERE id = ?', [p.denials[0].passengerIds[0]]);
    expect(pstatus).toBe('checked-in');
  });

  it('a selected passenger who boarded meanwhile is not denied: 409 not_present', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 2 });
    await addSingles(t.db, flight, 3);
    const p = (await propose(flight).expect(201)).body;
    await t.db.query(`UPDATE passengers SET status = 'boarded', boarded_at = NOW(3) WHERE id = ?`, [p.denials[0].passengerIds[0]]);
    expect((await supervisor.post(`/api/denial-proposals/${p.id}/authorize`).expect(409)).body.error).toBe('not_present');
  });
});
