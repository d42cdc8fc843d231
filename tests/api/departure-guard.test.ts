// Nothing new on a departed flight: rounds, raises, accepts, volunteers added at the counter, passenger bids through
// the link, approvals of new amounts and new denial proposals are refused with 409 flight_departed and store nothing,
// whether the departed state came from the feed or the desk, or the scheduled time plus the station's grace passed.
// Paying what is already owed stays possible (tests/api/approvals-issue.test.ts issues on departed flights).
// The 10-minute grace is the station's default, a figure of our own (common practice for a narrow-body turn).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DenialProposalEntity, FlightEntity, OfferApprovalEntity, VolunteerEntity, VolunteerRoundEntity } from '../../server/src/db/entities';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';
import { addBooking, makeFlight, removeFlights, settle, tokenOf } from './volunteers-fixtures';

const MINUTE = 60_000;
let t: TestApp;
let agent: Client;
let supervisor: Client;
let bos: number;
const flightIds: number[] = [];

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor] = await Promise.all([DEMO.agent, DEMO.supervisor].map((e) => signedIn(t, e)));
  bos = await stationIdByIata(t.db, 'BOS');
});

afterAll(async () => {
  await settle(t);
  await t.db.query('DELETE FROM denials WHERE flight_id IN (?)', [flightIds]);
  await t.db.query('DELETE FROM denial_proposals WHERE flight_id IN (?)', [flightIds]);
  await removeFlights(t.db, flightIds);
  await t.close();
});

async function flight(departure?: Date) {
  const f = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'BGR', departure });
  flightIds.push(f.id);
  return f;
}

const departed = (res: { status: number; body: { error?: string; message?: string } }) => {
  expect([res.status, res.body.error]).toEqual([409, 'flight_departed']);
  expect(res.body.message).toMatch(/has departed/);
};

describe('a flight whose scheduled time plus the station’s grace has passed', () => {
  it('opens no round and stores nothing, even with no departed state from the feed', async () => {
    const f = await flight(new Date(Date.now() - 30 * MINUTE));
    await t.db.getRepository(FlightEntity).update({ id: f.id }, { state: 'boarding' });
    departed(await agent.post(`/api/flights/${f.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: 1 }));
    expect(await t.db.getRepository(VolunteerRoundEntity).countBy({ flightId: f.id })).toBe(0);
  });

  it('takes no new denial proposal', async () => {
    const f = await flight(new Date(Date.now() - 30 * MINUTE));
    await addBooking(t.db, f, [['Late', 'Gate']]);
    departed(await supervisor.post(`/api/flights/${f.id}/denial-proposals`, { seatsNeeded: 1, reason: 'aircraft swap to a smaller type' }));
    expect(await t.db.getRepository(DenialProposalEntity).countBy({ flightId: f.id })).toBe(0);
  });
});

describe('a flight marked departed while its round is open', () => {
  it('refuses raises, accepts, counter volunteers, passenger bids and approvals of new amounts; closing stays possible', async () => {
    const f = await flight();
    const [first, second, third] = [await addBooking(t.db, f, [['Ann', 'Early']]), await addBooking(t.db, f, [['Bob', 'Early']]), await addBooking(t.db, f, [['Cat', 'Early']])];
    const { body: { id: roundId } } = await agent.post(`/api/flights/${f.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: 2 }).expect(201);
    const { body: { id: volunteerId } } = await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [first.passengers[0].id] }).expect(201);
    await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: 5_000_000 }).expect(200);
    const pending = await t.db.getRepository(OfferApprovalEntity).findOneByOrFail({ roundId, status: 'pending' });
    const token = tokenOf((await agent.get(`/api/flights/${f.id}/rounds`).expect(200)).body.bidLink);
    const who = await agent.agent.post(`/api/public/offers/${token}/identify`).set('X-Forwarded-For', '198.51.100.200').send({ pnr: third.booking.pnr, lastName: 'Early' }).expect(200);

    // The departure-control feed (or the desk) says the aircraft has left.
    await t.db.getRepository(FlightEntity).update({ id: f.id }, { state: 'departed' });
    departed(await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: 30_000 }));
    departed(await agent.post(`/api/rounds/${roundId}/volunteers/${volunteerId}/accept`));
    departed(await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [second.passengers[0].id] }));
    departed(await agent.agent.post(`/api/public/offers/${token}/bids`).set('X-Forwarded-For', '198.51.100.200').send({ passengerToken: who.body.passengerToken, acceptPosted: true }));
    departed(await supervisor.post(`/api/approvals/${pending.id}`, { approve: true }));

    const round = await t.db.getRepository(VolunteerRoundEntity).findOneByOrFail({ id: roundId });
    expect(round.offerMinor).toBe(20_000);
    expect((await t.db.getRepository(VolunteerEntity).findBy({ roundId })).map((v) => [v.bookingId, v.status])).toEqual([[first.booking.id, 'offered']]);
    // Declining a pending amount and closing the round only wind things down, so they stay possible.
    await supervisor.post(`/api/approvals/${pending.id}`, { approve: false, reason: 'the flight has gone' }).expect(200);
    await agent.post(`/api/rounds/${roundId}/close`).expect(200);
  });
});
