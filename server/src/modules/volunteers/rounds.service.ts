import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { z } from 'zod';
import type { openRoundBodySchema } from '@shared/schemas/volunteers';
import { BookingEntity, FlightEntity, OfferApprovalEntity, PassengerEntity, VolunteerEntity, VolunteerRoundEntity } from '../../db/entities';
import { badRequest, conflict, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { raiseVolunteerOffered } from '../alerts/work-alerts';
import { gateAmount } from '../approvals/approval-gate';
import { assertNotDeparted } from '../flights/departure-guard';
import { liftEarlierVolunteers } from './earlier-volunteers';
import { policyFor } from './policy.service';

type OpenRoundBody = z.infer<typeof openRoundBodySchema>;

export async function roundForUser(em: DataSource | EntityManager, user: SessionUser, roundId: number, lock = false) {
  const round = await em.getRepository(VolunteerRoundEntity).findOne({ where: { id: roundId }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
  if (!round || !canSeeStation(user, round.stationId)) throw notFound('Volunteer round');
  return round;
}

function assertOpen(round: VolunteerRoundEntity) {
  if (round.status !== 'open') throw conflict('round_closed', 'This volunteer round is closed.');
}

/**
 * Opens a round. A posted round's first offer goes through the approval gate like any amount: above the user's limit
 * the round opens without a standing offer (nobody can accept yet) and the offer waits for a supervisor.
 */
export async function openRound(db: DataSource, user: SessionUser, flight: FlightEntity, body: OpenRoundBody) {
  const policy = await policyFor(db, flight.stationId);
  return db.transaction(async (em) => {
    // One open round per flight: lock the flight row so two agents cannot open two rounds at once.
    const locked = await em.findOneOrFail(FlightEntity, { where: { id: flight.id }, lock: { mode: 'pessimistic_write' } });
    await assertNotDeparted(em, locked, 'opening a volunteer round');
    if (await em.findOneBy(VolunteerRoundEntity, { flightId: flight.id, status: 'open' })) throw conflict('round_already_open', 'A volunteer round is already open on this flight. Close it first.');
    const round = await em.save(em.create(VolunteerRoundEntity, {
      flightId: flight.id, stationId: flight.stationId, kind: body.kind, status: 'open', currency: policy.currency,
      offerMinor: null, extras: body.extras, volunteersNeeded: body.volunteersNeeded,
      openedByUserId: user.id, openedByLabel: user.email, closedAt: null,
    }));
    await audit(em, { actor: user, action: 'round.opened', entityType: 'volunteer_round', entityId: round.id, stationId: flight.stationId, after: { ...body, currency: policy.currency, flightId: flight.id } });
    recordEffect(em, flightChanged(flight.id, flight.stationId, ['rounds']));
    if (body.kind !== 'posted') return { round, approvalRequested: false };
    const gate = await gateAmount(em, user, { kind: 'opening-offer', stationId: round.stationId, flightId: round.flightId, roundId: round.id, amountMinor: body.offerMinor!, currency: round.currency });
    if (!gate.approved) return { round, approvalRequested: true };
    await setOffer(em, user, round, body.offerMinor!);
    return { round, approvalRequested: false };
  });
}

/** Raising within the user's limit applies at once; above it, a supervisor of the station approves. */
export async function raiseOffer(db: DataSource, user: SessionUser, roundId: number, offerMinor: number) {
  return db.transaction(async (em) => {
    const round = await roundForUser(em, user, roundId, true);
    assertOpen(round);
    if (round.kind !== 'posted') throw badRequest('offerMinor: only a posted offer can be raised', [{ field: 'offerMinor', rule: 'the round takes sealed bids' }]);
    if (offerMinor <= (round.offerMinor ?? 0)) throw badRequest('offerMinor: must be above the current offer', [{ field: 'offerMinor', rule: 'must be above the current offer' }]);
    await assertNotDeparted(em, round.flightId, 'raising the offer');
    recordEffect(em, flightChanged(round.flightId, round.stationId, ['rounds']));
    const gate = await gateAmount(em, user, { kind: 'raise', stationId: round.stationId, flightId: round.flightId, roundId: round.id, amountMinor: offerMinor, currency: round.currency });
    if (!gate.approved) return { round, approvalRequested: true };
    await setOffer(em, user, round, offerMinor);
    return { round, approvalRequested: false };
  });
}

/**
 * The one place a posted offer changes: the round takes the new amount and, under the station's raise policy,
 * volunteers accepted earlier at less are lifted to it (audited, and told in writing).
 */
async function setOffer(em: EntityManager, actor: SessionUser, round: VolunteerRoundEntity, offerMinor: number) {
  const action = round.offerMinor === null ? 'round.offer_set' : 'round.offer_raised';
  const before = { offerMinor: round.offerMinor };
  round.offerMinor = offerMinor;
  await em.save(round);
  await audit(em, { actor, action, entityType: 'volunteer_round', entityId: round.id, stationId: round.stationId, before, after: { offerMinor } });
  const policy = await policyFor(em, round.stationId);
  if (policy.raisePolicy === 'lift-to-new-offer') await liftEarlierVolunteers(em, round, offerMinor, 'raise policy: earlier volunteers get the new offer');
}

/**
 * A supervisor approved an opening offer or a raise: it applies now, unless the round closed meanwhile or a higher
 * offer already stands. The caller holds the round's lock and checked the departure guard.
 */
export async function applyApprovedOffer(em: EntityManager, decider: SessionUser, round: VolunteerRoundEntity, approval: OfferApprovalEntity) {
  if (round.status !== 'open' || (round.offerMinor ?? 0) >= approval.offerMinor) return;
  await setOffer(em, decider, round, approval.offerMinor);
}

export async function closeRound(db: DataSource, user: SessionUser, roundId: number) {
  return db.transaction(async (em) => {
    const round = await roundForUser(em, user, roundId, true);
    assertOpen(round);
    round.status = 'closed';
    round.closedAt = new Date();
    await em.save(round);
    await em.update(OfferApprovalEntity, { roundId, status: 'pending' }, { status: 'rejected', reason: 'round closed', decidedAt: new Date() });
    await audit(em, { actor: user, action: 'round.closed', entityType: 'volunteer_round', entityId: round.id, stationId: round.stationId, after: { status: 'closed' } });
    // Amounts that waited on the round are closed with it.
    recordEffect(em, flightChanged(round.flightId, round.stationId, ['rounds', 'approvals']));
    return round;
  });
}

/**
 * Records a booking's offer to give up its seats. A party volunteers whole unless it chooses to split: naming only
 * some of its members records that choice on the booking.
 */
/** An agent puts passengers of the flight forward as volunteers in an open round (the first one names the booking). */
export async function addVolunteerAtDesk(db: DataSource, user: SessionUser, roundId: number, passengerIds: number[], askMinor: number | null) {
  return db.transaction(async (em) => {
    const round = await roundForUser(em, user, roundId, true);
    const first = await em.findOneBy(PassengerEntity, { id: passengerIds[0], flightId: round.flightId });
    if (!first) throw badRequest('passengerIds: must be passengers of this flight', [{ field: 'passengerIds', rule: 'must be passengers of this flight' }]);
    return addVolunteer(em, round, first.bookingId, passengerIds, askMinor, 'agent', user);
  });
}

export async function addVolunteer(em: EntityManager, round: VolunteerRoundEntity, bookingId: number, passengerIds: number[] | null, askMinor: number | null, source: 'agent' | 'passenger-link', actor: SessionUser | { label: string }) {
  assertOpen(round);
  await assertNotDeparted(em, round.flightId, 'offering a seat');
  const party = await em.findBy(PassengerEntity, { bookingId, flightId: round.flightId });
  const eligible = party.filter((p) => p.status === 'booked' || p.status === 'checked-in');
  const chosen = passengerIds ?? eligible.map((p) => p.id);
  if (!chosen.length || chosen.some((id) => !eligible.some((p) => p.id === id))) {
    throw badRequest('passengerIds: every volunteer must be on this booking and not yet boarded', [{ field: 'passengerIds', rule: 'must be passengers of one booking on this flight who have not boarded' }]);
  }
  if (round.kind === 'sealed' && askMinor === null) throw badRequest('askMinor: a sealed-bid round needs the amount the volunteer asks', [{ field: 'askMinor', rule: 'required in a sealed-bid round' }]);
  if (chosen.length < eligible.length) await em.update(BookingEntity, { id: bookingId }, { travelsTogether: false });
  const existing = await em.findOne(VolunteerEntity, { where: { roundId: round.id, bookingId }, lock: { mode: 'pessimistic_write' } });
  if (existing && existing.status !== 'offered' && existing.status !== 'withdrawn') throw conflict('already_decided', 'This booking’s offer was already decided in this round.');
  const v = existing ?? em.create(VolunteerEntity, { roundId: round.id, flightId: round.flightId, bookingId, source, agreedMinor: null, acceptedByUserId: null, acceptedAt: null });
  // A changed offer is a new offer: a supervisor's decision waiting on the old ask no longer applies to it.
  if (existing) await em.update(OfferApprovalEntity, { kind: 'sealed-accept', subjectId: existing.id, status: 'pending' }, { status: 'rejected', reason: 'the volunteer changed their offer', decidedAt: new Date() });
  Object.assign(v, { passengerIds: chosen, askMinor: round.kind === 'sealed' ? askMinor : null, status: 'offered' });
  await em.save(v);
  await raiseVolunteerOffered(em, v, round.stationId, round.currency);
  await audit(em, { actor, action: existing ? 'volunteer.offer_updated' : 'volunteer.offered', entityType: 'volunteer', entityId: v.id, stationId: round.stationId, after: { bookingId, passengerIds: chosen, askMinor: v.askMinor, source } });
  recordEffect(em, flightChanged(round.flightId, round.stationId, ['rounds']));
  return v;
}
