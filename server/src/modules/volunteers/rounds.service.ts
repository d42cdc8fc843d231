import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { z } from 'zod';
import type { openRoundBodySchema } from '@shared/schemas/volunteers';
import { BookingEntity, FlightEntity, OfferApprovalEntity, PassengerEntity, VolunteerEntity, VolunteerRoundEntity } from '../../db/entities';
import { badRequest, conflict, forbidden, notFound } from '../../http/errors';
import { canSeeStation } from '../../http/require-role';
import { audit } from '../audit/audit.service';
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

export async function openRound(db: DataSource, user: SessionUser, flight: FlightEntity, body: OpenRoundBody) {
  const policy = await policyFor(db, flight.stationId);
  if (body.kind === 'posted' && body.offerMinor! > policy.agentLimitMinor && user.role === 'agent') {
    throw badRequest(`offerMinor: an opening offer above the agent limit needs a supervisor; open at or below ${policy.agentLimitMinor / 100} and raise it`, [{ field: 'offerMinor', rule: 'must be at most the agent limit to open a round' }]);
  }
  return db.transaction(async (em) => {
    // One open round per flight: lock the flight row so two agents cannot open two rounds at once.
    await em.findOne(FlightEntity, { where: { id: flight.id }, lock: { mode: 'pessimistic_write' } });
    if (await em.findOneBy(VolunteerRoundEntity, { flightId: flight.id, status: 'open' })) throw conflict('round_already_open', 'A volunteer round is already open on this flight. Close it first.');
    const round = await em.save(em.create(VolunteerRoundEntity, {
      flightId: flight.id, stationId: flight.stationId, kind: body.kind, status: 'open', currency: policy.currency,
      offerMinor: body.kind === 'posted' ? body.offerMinor! : null, extras: body.extras, volunteersNeeded: body.volunteersNeeded,
      openedByUserId: user.id, openedByLabel: user.email, closedAt: null,
    }));
    await audit(em, { actor: user, action: 'round.opened', entityType: 'volunteer_round', entityId: round.id, stationId: flight.stationId, after: { ...body, currency: policy.currency, flightId: flight.id } });
    return round;
  });
}

/** Raising within the agent's limit applies at once; above it, a supervisor approves (a supervisor's own raise applies). */
export async function raiseOffer(db: DataSource, user: SessionUser, roundId: number, offerMinor: number) {
  return db.transaction(async (em) => {
    const round = await roundForUser(em, user, roundId, true);
    assertOpen(round);
    if (round.kind !== 'posted') throw badRequest('offerMinor: only a posted offer can be raised', [{ field: 'offerMinor', rule: 'the round takes sealed bids' }]);
    if (offerMinor <= (round.offerMinor ?? 0)) throw badRequest('offerMinor: must be above the current offer', [{ field: 'offerMinor', rule: 'must be above the current offer' }]);
    const policy = await policyFor(em, round.stationId);
    if (offerMinor > policy.agentLimitMinor && user.role === 'agent') {
      const pending = await em.findOneBy(OfferApprovalEntity, { roundId, status: 'pending' });
      if (pending) throw conflict('approval_pending', 'An offer already waits for a supervisor on this round.');
      const approval = await em.save(em.create(OfferApprovalEntity, { roundId, stationId: round.stationId, offerMinor, status: 'pending', requestedByUserId: user.id, requestedByLabel: user.email, decidedByUserId: null, reason: '' }));
      await audit(em, { actor: user, action: 'round.offer_approval_requested', entityType: 'volunteer_round', entityId: round.id, stationId: round.stationId, before: { offerMinor: round.offerMinor }, after: { offerMinor, approvalId: approval.id } });
      return { round, approvalRequested: true };
    }
    const before = { offerMinor: round.offerMinor };
    round.offerMinor = offerMinor;
    await em.save(round);
    await audit(em, { actor: user, action: 'round.offer_raised', entityType: 'volunteer_round', entityId: round.id, stationId: round.stationId, before, after: { offerMinor } });
    return { round, approvalRequested: false };
  });
}

/**
 * A supervisor decides an offer above the agent limit. Four eyes (common practice): whoever asked for the offer
 * cannot approve it. Locks are taken round first, then approval, the same order as raising and closing a round, so
 * a decision and a close at the same moment wait for each other instead of deadlocking.
 */
export async function decideApproval(db: DataSource, user: SessionUser, approvalId: number, approve: boolean, reason: string) {
  return db.transaction(async (em) => {
    const found = await em.findOneBy(OfferApprovalEntity, { id: approvalId });
    if (!found || !canSeeStation(user, found.stationId)) throw notFound('Approval');
    const round = await roundForUser(em, user, found.roundId, true);
    const approval = await em.findOneOrFail(OfferApprovalEntity, { where: { id: approvalId }, lock: { mode: 'pessimistic_write' } });
    if (approval.status !== 'pending') throw conflict('approval_decided', 'This approval was already decided.');
    if (approval.requestedByUserId === user.id) throw forbidden('You asked for this offer; another supervisor must decide it.');
    approval.status = approve ? 'approved' : 'rejected';
    approval.decidedByUserId = user.id;
    approval.reason = reason;
    await em.save(approval);
    const before = { offerMinor: round.offerMinor };
    if (approve && round.status === 'open') {
      round.offerMinor = Math.max(round.offerMinor ?? 0, approval.offerMinor);
      await em.save(round);
    }
    await audit(em, { actor: user, action: approve ? 'round.offer_approved' : 'round.offer_rejected', entityType: 'offer_approval', entityId: approval.id, stationId: approval.stationId, before, after: { offerMinor: round.offerMinor, reason } });
    return round;
  });
}

export async function closeRound(db: DataSource, user: SessionUser, roundId: number) {
  return db.transaction(async (em) => {
    const round = await roundForUser(em, user, roundId, true);
    assertOpen(round);
    round.status = 'closed';
    round.closedAt = new Date();
    await em.save(round);
    await em.update(OfferApprovalEntity, { roundId, status: 'pending' }, { status: 'rejected', reason: 'round closed' });
    await audit(em, { actor: user, action: 'round.closed', entityType: 'volunteer_round', entityId: round.id, stationId: round.stationId, after: { status: 'closed' } });
    return round;
  });
}

/**
 * Records a booking's offer to give up its seats. A party volunteers whole unless it chooses to split: naming only
 * some of its members records that choice on the booking.
 */
export async function addVolunteer(em: EntityManager, round: VolunteerRoundEntity, bookingId: number, passengerIds: number[] | null, askMinor: number | null, source: 'agent' | 'passenger-link', actor: SessionUser | { label: string }) {
  assertOpen(round);
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
  Object.assign(v, { passengerIds: chosen, askMinor: round.kind === 'sealed' ? askMinor : null, status: 'offered' });
  await em.save(v);
  await audit(em, { actor, action: existing ? 'volunteer.offer_updated' : 'volunteer.offered', entityType: 'volunteer', entityId: v.id, stationId: round.stationId, after: { bookingId, passengerIds: chosen, askMinor: v.askMinor, source } });
  return v;
}
