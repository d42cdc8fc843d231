// Accepting volunteers under load: many agents pressing "accept" at once must never take more volunteers than the
// round needs, nor accept the same one twice, nor create more than one compensation per passenger. Parties volunteer
// together unless they choose to split.
// Outside sources: MariaDB documentation on InnoDB locking reads (SELECT ... FOR UPDATE blocks other locking reads
// of the row until commit) and on READ COMMITTED (each read sees what committed before it), from memory.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { In } from 'typeorm';
import { BookingEntity, CompensationEntity, OutboxMessageEntity, VolunteerEntity, type FlightEntity } from '../../server/src/db/entities';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';
import { addBooking, addSingles, makeFlight, removeFlights, settle, tokenOf, type Booked } from './volunteers-fixtures';

let t: TestApp;
let desks: Client[];
let bos: number;
const flightIds: number[] = [];

beforeAll(async () => {
  t = await startTestApp();
  // Three people at three desks, each with their own session, as at a real gate.
  desks = await Promise.all([DEMO.agent, DEMO.supervisor, DEMO.admin].map((e) => signedIn(t, e)));
  bos = await stationIdByIata(t.db, 'BOS');
});

afterAll(async () => {
  await settle(t);
  await removeFlights(t.db, flightIds);
  await t.close();
});

async function flightWithRound(volunteersNeeded: number): Promise<{ flight: FlightEntity; roundId: number }> {
  const flight = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'BTV' });
  flightIds.push(flight.id);
  const res = await desks[0].post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded }).expect(201);
  return { flight, roundId: res.body.id };
}

async function offer(roundId: number, party: Booked, passengerIds = party.passengers.map((p) => p.id)): Promise<number> {
  return (await desks[0].post(`/api/rounds/${roundId}/volunteers`, { passengerIds }).expect(201)).body.id;
}

describe('concurrent accepts', () => {
  it('20 agents accepting 20 different volunteers of a round that needs 3: exactly 3 accepted, the rest round_full', async () => {
    const { flight, roundId } = await flightWithRound(3);
    const singles = await addSingles(t.db, flight, 20, 'Rush');
    const volunteerIds: number[] = [];
    for (const s of singles) volunteerIds.push(await offer(roundId, s));

    const results = await Promise.all(volunteerIds.map((id, i) => desks[i % desks.length].post(`/api/rounds/${roundId}/volunteers/${id}/accept`)));

    const ok = results.filter((r) => r.status === 200);
    const refused = results.filter((r) => r.status !== 200);
    expect(ok).toHaveLength(3);
    expect(refused).toHaveLength(17);
    expect(refused.every((r) => r.status === 409 && r.body.error === 'round_full'), JSON.stringify(refused.map((r) => [r.status, r.body.error]))).toBe(true);
    const accepted = await t.db.getRepository(VolunteerEntity).findBy({ roundId, status: 'accepted' });
    expect(accepted).toHaveLength(3);
    const comps = await t.db.getRepository(CompensationEntity).findBy({ sourceKind: 'volunteer', sourceId: In(volunteerIds) });
    expect(comps).toHaveLength(3);
    expect(new Set(comps.map((c) => c.passengerId)).size).toBe(3);
    // One written confirmation per accepted volunteer, and none for those refused.
    const mail = await t.db.getRepository(OutboxMessageEntity).findBy({ flightId: flight.id, kind: 'volunteer-confirmation' });
    expect(mail.map((m) => m.dedupeKey).sort()).toEqual(accepted.map((v) => `volunteer-confirmation:${v.id}`).sort());
    const round = (await desks[0].get(`/api/flights/${flight.id}/rounds`).expect(200)).body.rounds[0];
    expect(round.accepted).toBe(3);
  });

  it('10 agents accepting the same volunteer at once: exactly one succeeds, one compensation, one confirmation', async () => {
    const { flight, roundId } = await flightWithRound(3);
    const [single] = await addSingles(t.db, flight, 1, 'Twice');
    const id = await offer(roundId, single);

    const results = await Promise.all(Array.from({ length: 10 }, (_, i) => desks[i % desks.length].post(`/api/rounds/${roundId}/volunteers/${id}/accept`)));

    expect(results.filter((r) => r.status === 200)).toHaveLength(1);
    const refused = results.filter((r) => r.status !== 200);
    expect(refused.every((r) => r.status === 409 && r.body.error === 'already_decided'), JSON.stringify(refused.map((r) => [r.status, r.body.error]))).toBe(true);
    expect(await t.db.getRepository(CompensationEntity).countBy({ sourceKind: 'volunteer', sourceId: id })).toBe(1);
    expect(await t.db.getRepository(OutboxMessageEntity).countBy({ flightId: flight.id, kind: 'volunteer-confirmation' })).toBe(1);
  });
});

describe('parties', () => {
  it('a PNR of 3 volunteers as one party and takes 3 seats: it does not fit a round that needs 2', async () => {
    const { flight, roundId } = await flightWithRound(2);
    const family = await addBooking(t.db, flight, [['Ann', 'Trio'], ['Bo', 'Trio'], ['Cal', 'Trio']]);
    const id = await offer(roundId, family);
    const res = await desks[0].post(`/api/rounds/${roundId}/volunteers/${id}/accept`);
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('round_full');
    expect(res.body.message).toContain('party of 3');
    expect(await t.db.getRepository(CompensationEntity).countBy({ sourceKind: 'volunteer', sourceId: id })).toBe(0);
  });

  it('a party of 3 offering through the passenger link volunteers whole: 3 seats, 3 compensation rows, still travelling together', async () => {
    const { flight, roundId } = await flightWithRound(3);
    const family = await addBooking(t.db, flight, [['Ann', 'Quad'], ['Bo', 'Quad'], ['Cal', 'Quad']]);
    const token = tokenOf((await desks[0].get(`/api/flights/${flight.id}/rounds`).expect(200)).body.bidLink);
    const who = await desks[0].agent.post(`/api/public/offers/${token}/identify`).set('X-Forwarded-For', '198.51.100.31').send({ pnr: family.booking.pnr, lastName: 'quad' }).expect(200);
    expect(who.body.names).toEqual(['Ann Quad', 'Bo Quad', 'Cal Quad']);
    await desks[0].agent.post(`/api/public/offers/${token}/bids`).send({ passengerToken: who.body.passengerToken, acceptPosted: true }).expect(201);
    const v = await t.db.getRepository(VolunteerEntity).findOneByOrFail({ roundId, bookingId: family.booking.id });
    expect(v.passengerIds.sort()).toEqual(family.passengers.map((p) => p.id).sort());
    expect(v.source).toBe('passenger-link');
    await desks[0].post(`/api/rounds/${roundId}/volunteers/${v.id}/accept`).expect(200);
    expect(await t.db.getRepository(CompensationEntity).countBy({ sourceKind: 'volunteer', sourceId: v.id })).toBe(3);
    expect((await t.db.getRepository(BookingEntity).findOneByOrFail({ id: family.booking.id })).travelsTogether).toBe(true);
    expect((await desks[0].get(`/api/flights/${flight.id}/rounds`).expect(200)).body.rounds[0].accepted).toBe(3);
  });

  it('naming 1 of 3 splits the party by choice: travelsTogether becomes false and one seat is taken', async () => {
    const { flight, roundId } = await flightWithRound(1);
    const family = await addBooking(t.db, flight, [['Ann', 'Split'], ['Bo', 'Split'], ['Cal', 'Split']]);
    const id = await offer(roundId, family, [family.passengers[1].id]);
    expect((await t.db.getRepository(BookingEntity).findOneByOrFail({ id: family.booking.id })).travelsTogether).toBe(false);
    await desks[0].post(`/api/rounds/${roundId}/volunteers/${id}/accept`).expect(200);
    const comps = await t.db.getRepository(CompensationEntity).findBy({ sourceKind: 'volunteer', sourceId: id });
    expect(comps.map((c) => c.passengerId)).toEqual([family.passengers[1].id]);
  });

  it('refuses a volunteer list that mixes bookings, naming the field', async () => {
    const { flight, roundId } = await flightWithRound(2);
    const [a, b] = await addSingles(t.db, flight, 2, 'Mixed');
    const res = await desks[0].post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [a.passengers[0].id, b.passengers[0].id] });
    expect(res.status).toBe(400);
    expect(res.body.details[0].field).toBe('passengerIds');
  });
});
