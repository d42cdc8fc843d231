// What the route × role matrix needs for the volunteer routes: calls that change an object take a fresh one from a
// pool (one per request, refused requests included), so each allowed role meets an object in the state its call
// expects. Own-station objects sit on flights of their own at BOS; other-station ones on the matrix's foreign flight.
import { In, type DataSource } from 'typeorm';
import type { VolunteerPolicy } from '@shared/schemas/volunteers';
import { BookingEntity, OfferApprovalEntity, VolunteerEntity, VolunteerRoundEntity, type FlightEntity } from '../../server/src/db/entities';
import { policyFor } from '../../server/src/modules/volunteers/policy.service';
import { signedIn, type Client, type TestApp } from './harness';
import { DEMO } from './helpers';
import { addBooking, makeFlight, removeFlights, tokenOf, uniquePnr } from './volunteers-fixtures';

/** Enough for every request one row makes: not signed in, each refused role, each allowed role (at most 6). */
const POOL = 8;

export interface VolunteerRouteContext {
  nextRoundlessFlight(): number;
  nextRaiseRound(): number;
  nextCloseRound(): number;
  nextAcceptVolunteer(): number;
  nextDeclineVolunteer(): number;
  nextRebookVolunteer(): number;
  nextApproval(): number;
  /** An open posted round that takes the same passenger again and again (a repeat offer updates the first). */
  offerRoundId: number;
  offerPassengerId: number;
  /** The own station's volunteer policy as found: writing it back changes nothing. */
  ownPolicy: VolunteerPolicy;
  /** The passenger link of the open round, a booking on it, and a passenger token from identifying as it. */
  offerToken: string;
  publicBooking: { pnr: string; lastName: string };
  passengerToken: string;
  other: { roundId: number; volunteerId: number; approvalId: number };
}

interface Made {
  flightIds: number[];
  otherRoundId: number;
  otherVolunteerId: number;
  otherBookingId: number;
}

let made: Made | null = null;

const take = (pool: number[], what: string) => () => {
  const next = pool.shift();
  if (next === undefined) throw new Error(`the volunteer route pool of ${what} is used up; raise POOL`);
  return next;
};

async function openRound(db: DataSource, flight: FlightEntity, openedByUserId: number, volunteersNeeded = 1, status: 'open' | 'closed' = 'open'): Promise<VolunteerRoundEntity> {
  return db.getRepository(VolunteerRoundEntity).save({
    flightId: flight.id, stationId: flight.stationId, kind: 'posted' as const, status, currency: 'USD', offerMinor: 20_000,
    extras: [], volunteersNeeded, openedByUserId, openedByLabel: 'route matrix', closedAt: status === 'closed' ? new Date() : null,
  });
}

async function volunteers(db: DataSource, flight: FlightEntity, roundId: number, status: 'offered' | 'accepted'): Promise<number[]> {
  const ids: number[] = [];
  for (let i = 0; i < POOL; i++) {
    const { booking, passengers } = await addBooking(db, flight, [[`Matrix${i + 1}`, status === 'offered' ? 'Offered' : 'Accepted']], null);
    const v = await db.getRepository(VolunteerEntity).save({
      roundId, flightId: flight.id, bookingId: booking.id, passengerIds: [passengers[0].id], askMinor: null, source: 'agent' as const, status,
      agreedMinor: status === 'accepted' ? 20_000 : null, acceptedByUserId: null, acceptedAt: status === 'accepted' ? new Date() : null,
    });
    ids.push(v.id);
  }
  return ids;
}

export async function volunteerRouteContext(t: TestApp, o: { ownStationId: number; otherFlight: FlightEntity; requesterUserId: number }): Promise<VolunteerRouteContext> {
  const db = t.db;
  const flightIds: number[] = [];
  const flight = async () => {
    const f = await makeFlight(db, { stationId: o.ownStationId, origin: 'BOS', destination: 'LEB' });
    flightIds.push(f.id);
    return f;
  };
  const roundless: number[] = [];
  const raise: number[] = [];
  const close: number[] = [];
  for (let i = 0; i < POOL; i++) {
    roundless.push((await flight()).id);
    raise.push((await openRound(db, await flight(), o.requesterUserId)).id);
    close.push((await openRound(db, await flight(), o.requesterUserId)).id);
  }
  const desk = await flight();
  const round = await openRound(db, desk, o.requesterUserId, 60);
  const accept = await volunteers(db, desk, round.id, 'offered');
  const decline = await volunteers(db, desk, round.id, 'offered');
  const rebook = await volunteers(db, desk, round.id, 'accepted');
  const approvals: number[] = [];
  for (let i = 0; i < POOL; i++) {
    // Asked for by the matrix's own agent, so any supervisor or admin may decide it (whoever asked may not).
    approvals.push((await db.getRepository(OfferApprovalEntity).save({ roundId: round.id, stationId: o.ownStationId, offerMinor: 30_000 + i, status: 'pending' as const, requestedByUserId: o.requesterUserId, requestedByLabel: 'route matrix', decidedByUserId: null, reason: '' })).id);
  }
  const offered = await addBooking(db, desk, [['Matrix', 'Repeat']], null);
  const pub = await addBooking(db, desk, [['Matrix', 'Public']], null);

  const agent: Client = await signedIn(t, DEMO.agent);
  const offerToken = tokenOf((await agent.get(`/api/flights/${desk.id}/rounds`).expect(200)).body.bidLink);
  const who = await agent.agent.post(`/api/public/offers/${offerToken}/identify`).send({ pnr: pub.booking.pnr, lastName: 'Public' }).expect(200);

  // Another station's round, volunteer and approval: every call on them must be refused before anything is read.
  // Closed, so the shared foreign flight never shows an open round of ours to anyone else.
  const otherRound = await openRound(db, o.otherFlight, o.requesterUserId, 1, 'closed');
  const otherBooking = await db.getRepository(BookingEntity).save({ flightId: o.otherFlight.id, pnr: uniquePnr(), contactEmail: null, travelsTogether: true, status: 'active' as const });
  const otherVolunteer = await db.getRepository(VolunteerEntity).save({ roundId: otherRound.id, flightId: o.otherFlight.id, bookingId: otherBooking.id, passengerIds: [], askMinor: null, source: 'agent' as const, status: 'accepted' as const, agreedMinor: 20_000, acceptedByUserId: null, acceptedAt: new Date() });
  const otherApproval = await db.getRepository(OfferApprovalEntity).save({ roundId: otherRound.id, stationId: o.otherFlight.stationId, offerMinor: 30_000, status: 'pending' as const, requestedByUserId: o.requesterUserId, requestedByLabel: 'route matrix', decidedByUserId: null, reason: '' });
  made = { flightIds, otherRoundId: otherRound.id, otherVolunteerId: otherVolunteer.id, otherBookingId: otherBooking.id };

  return {
    nextRoundlessFlight: take(roundless, 'flights without a round'),
    nextRaiseRound: take(raise, 'rounds to raise'),
    nextCloseRound: take(close, 'rounds to close'),
    nextAcceptVolunteer: take(accept, 'volunteers to accept'),
    nextDeclineVolunteer: take(decline, 'volunteers to decline'),
    nextRebookVolunteer: take(rebook, 'volunteers to rebook'),
    nextApproval: take(approvals, 'pending approvals'),
    offerRoundId: round.id,
    offerPassengerId: offered.passengers[0].id,
    ownPolicy: await policyFor(db, o.ownStationId),
    offerToken,
    publicBooking: { pnr: pub.booking.pnr, lastName: 'Public' },
    passengerToken: who.body.passengerToken,
    other: { roundId: otherRound.id, volunteerId: otherVolunteer.id, approvalId: otherApproval.id },
  };
}

/** Removes what volunteerRouteContext made; the matrix's foreign flight itself stays for later runs. */
export async function removeVolunteerRouteFixtures(db: DataSource, flushForecasts: () => Promise<void>): Promise<void> {
  if (!made) return;
  // The accepts queue a forecast recompute; let it land before its rows are removed.
  await flushForecasts();
  await removeFlights(db, made.flightIds);
  await db.getRepository(OfferApprovalEntity).delete({ roundId: made.otherRoundId });
  await db.getRepository(VolunteerEntity).delete({ id: In([made.otherVolunteerId]) });
  await db.getRepository(VolunteerRoundEntity).delete({ id: made.otherRoundId });
  await db.getRepository(BookingEntity).delete({ id: made.otherBookingId });
  made = null;
}
