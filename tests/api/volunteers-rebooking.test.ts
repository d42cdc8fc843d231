// Rebooking accepted volunteers: a seat is held on a later flight only while one is free, two agents racing for the
// last seat never both get it, and the planned arrival delay is computed from the schedules. The rebooking notice
// goes out with the hold, once.
// Outside source for why the delay matters: 14 CFR 250.5(a) ties denied-boarding compensation to the planned arrival
// delay of the substitute flight (1 and 2 hours domestic, 1 and 4 international), from memory; the figures here
// are derived from the schedules written below.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessageEntity, PassengerEntity, RebookingEntity, type FlightEntity } from '../../server/src/db/entities';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';
import { addBooking, addSingles, makeFlight, outboxByKey, removeFlights, settle, type Booked } from './volunteers-fixtures';

const MINUTE = 60_000;
let t: TestApp;
let agent: Client;
let supervisor: Client;
let original: FlightEntity;
let oneSeatLeft: FlightEntity;
let full: FlightEntity;
let otherRoute: FlightEntity;
let roundId: number;
const volunteers: { id: number; party: Booked }[] = [];
const flightIds: number[] = [];

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor] = await Promise.all([DEMO.agent, DEMO.supervisor].map((e) => signedIn(t, e)));
  const bos = await stationIdByIata(t.db, 'BOS');
  const departure = new Date(Date.UTC(2034, 5, 1, 13, 0) + Math.floor(Math.random() * 180) * 86_400_000);
  // BOS-ACK, 2 h 30 min; the alternates leave 3 h and 5 h later and fly 2 h 45 min.
  original = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'ACK', departure, durationMinutes: 150 });
  oneSeatLeft = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'ACK', departure: new Date(departure.getTime() + 180 * MINUTE), durationMinutes: 165, seats: 3 });
  full = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'ACK', departure: new Date(departure.getTime() + 300 * MINUTE), durationMinutes: 165, seats: 2 });
  otherRoute = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'MVY', departure: new Date(departure.getTime() + 60 * MINUTE) });
  flightIds.push(original.id, oneSeatLeft.id, full.id, otherRoute.id);
  await addSingles(t.db, oneSeatLeft, 2, 'Aboard');
  const [cancelled] = await addSingles(t.db, oneSeatLeft, 1, 'Gone');
  // A cancelled passenger holds no seat, so the flight of 3 seats keeps one free.
  await t.db.getRepository(PassengerEntity).update({ id: cancelled.passengers[0].id }, { status: 'cancelled' });
  await addSingles(t.db, full, 2, 'Aboard');

  roundId = (await agent.post(`/api/flights/${original.id}/rounds`, { kind: 'posted', offerMinor: 30_000, extras: ['Meal voucher'], volunteersNeeded: 5 }).expect(201)).body.id;
  const parties = [...await addSingles(t.db, original, 3, 'Mover'), await addBooking(t.db, original, [['Ann', 'Pair'], ['Bo', 'Pair']])];
  for (const party of parties) {
    const id = (await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: party.passengers.map((p) => p.id) }).expect(201)).body.id;
    await agent.post(`/api/rounds/${roundId}/volunteers/${id}/accept`).expect(200);
    volunteers.push({ id, party });
  }
});

afterAll(async () => {
  await settle(t);
  await removeFlights(t.db, flightIds);
  await t.close();
});

const rebook = (c: Client, volunteerId: number, body: object) => c.post(`/api/volunteers/${volunteerId}/rebook`, body);

describe('alternates', () => {
  it('lists later flights on the same route with their free seats and planned arrival delay', async () => {
    const { alternates } = (await agent.get(`/api/flights/${original.id}/alternates`).expect(200)).body;
    expect(alternates.map((a: { id: number }) => a.id)).toEqual([oneSeatLeft.id, full.id]);
    // derived: (3 h + 2 h 45) - 2 h 30 = 195 minutes; (5 h + 2 h 45) - 2 h 30 = 315 minutes.
    expect(alternates[0]).toMatchObject({ label: `ZV ${oneSeatLeft.flightNumber}`, freeSeats: 1, plannedArrivalDelayMinutes: 195 });
    expect(alternates[1]).toMatchObject({ freeSeats: 0, plannedArrivalDelayMinutes: 315 });
  });
});

describe('holding seats', () => {
  it('refuses a full flight with 409 no_seats and holds nothing, sends nothing', async () => {
    const res = await rebook(agent, volunteers[0].id, { alternateFlightId: full.id });
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('no_seats');
    expect(await t.db.getRepository(RebookingEntity).countBy({ volunteerId: volunteers[0].id })).toBe(0);
    expect(await outboxByKey(t.db, `rebooking-notice:volunteer:${volunteers[0].id}`)).toHaveLength(0);
  });

  it('refuses a party of 2 where one seat is free', async () => {
    const res = await rebook(agent, volunteers[3].id, { alternateFlightId: oneSeatLeft.id });
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('no_seats');
    expect(res.body.message).toContain('needs 2');
  });

  it('gives the last seat to exactly one of two agents rebooking at the same moment', async () => {
    const [a, b] = await Promise.all([rebook(agent, volunteers[0].id, { alternateFlightId: oneSeatLeft.id }), rebook(supervisor, volunteers[1].id, { alternateFlightId: oneSeatLeft.id })]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    expect(loser.body.error).toBe('no_seats');
    const holds = await t.db.getRepository(RebookingEntity).findBy({ alternateFlightId: oneSeatLeft.id });
    expect(holds).toHaveLength(1);
    expect(holds[0]).toMatchObject({ seats: 1, plannedArrivalDelayMinutes: 195, originalFlightId: original.id });
    const winner = a.status === 200 ? a : b;
    expect(winner.body).toEqual({ plannedArrivalDelayMinutes: 195, label: `ZV ${oneSeatLeft.flightNumber}` });
    const { alternates } = (await agent.get(`/api/flights/${original.id}/alternates`).expect(200)).body;
    expect(alternates[0].freeSeats).toBe(0);
  });

  it('refuses a second hold for a volunteer already rebooked', async () => {
    const held = (await t.db.getRepository(RebookingEntity).findOneByOrFail({ alternateFlightId: oneSeatLeft.id })).volunteerId!;
    const res = await rebook(agent, held, { manual: { carrier: 'XY', number: '204', departure: '2034-12-01T20:00:00Z', arrival: '2034-12-01T22:00:00Z' } });
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('already_rebooked');
  });

  it('books another carrier’s flight by hand, with the delay computed from its arrival', async () => {
    const v = volunteers[2];
    const arrival = new Date(original.scheduledArrival.getTime() + 100 * MINUTE);
    const res = await rebook(agent, v.id, { manual: { carrier: 'XY', number: '204', departure: new Date(original.scheduledDeparture.getTime() + 90 * MINUTE).toISOString(), arrival: arrival.toISOString() } }).expect(200);
    // derived: the hand-entered flight lands 100 minutes after the original was due.
    expect(res.body).toEqual({ plannedArrivalDelayMinutes: 100, label: 'XY 204' });
    const mail = await outboxByKey(t.db, `rebooking-notice:volunteer:${v.id}`);
    expect(mail).toHaveLength(1);
    expect(mail[0].text).toContain('XY 204 from BOS to ACK');
    expect(mail[0].text).toContain('1 hour 40 minutes later');
  });

  it('refuses a hand-entered arrival before its departure, and a flight on another route, naming the field', async () => {
    const v = volunteers[3];
    const backwards = await rebook(agent, v.id, { manual: { carrier: 'XY', number: '9', departure: '2034-12-01T20:00:00Z', arrival: '2034-12-01T19:00:00Z' } });
    expect(backwards.status).toBe(400);
    expect(backwards.body.details[0].field).toBe('manual.arrival');
    const elsewhere = await rebook(agent, v.id, { alternateFlightId: otherRoute.id });
    expect(elsewhere.status).toBe(400);
    expect(elsewhere.body.details[0].field).toBe('alternateFlightId');
  });

  it('refuses to rebook a volunteer who was not accepted', async () => {
    const [late] = await addSingles(t.db, original, 1, 'Late');
    const id = (await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [late.passengers[0].id] }).expect(201)).body.id;
    const res = await rebook(agent, id, { manual: { carrier: 'XY', number: '204', departure: '2034-12-01T20:00:00Z', arrival: '2034-12-01T22:00:00Z' } });
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('not_accepted');
  });

  it('queued one rebooking notice per hold and none for the refusals', async () => {
    const notices = await t.db.getRepository(OutboxMessageEntity).findBy({ flightId: original.id, kind: 'rebooking-notice' });
    const holds = await t.db.getRepository(RebookingEntity).findBy({ originalFlightId: original.id });
    expect(notices.map((n) => n.dedupeKey).sort()).toEqual(holds.map((h) => `rebooking-notice:volunteer:${h.volunteerId}`).sort());
    expect(holds).toHaveLength(2);
  });
});
