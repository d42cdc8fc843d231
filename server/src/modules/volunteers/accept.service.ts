import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { OfferApprovalEntity, StationEntity, VolunteerEntity, type VolunteerRoundEntity } from '../../db/entities';
import { recordCompensationDue } from '../compensations/compensation-due';
import { gateAmount } from '../approvals/approval-gate';
import { assertNotDeparted } from '../flights/departure-guard';
import { liftEarlierVolunteers } from './earlier-volunteers';
import { conflict, notFound } from '../../domain/errors';
import { flightChanged, flightMoved, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { enqueueMessage } from '../outbox/outbox.service';
import { policyFor } from './policy.service';
import { roundForUser } from './rounds.service';
import { enqueueConfirmation, type Enqueue } from './volunteer-notices';

const isRetryable = (err: unknown) => ['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT'].includes((err as { driverError?: { code?: string } })?.driverError?.code ?? '');

/**
 * Accepts one volunteer, records what each passenger of the party is owed (as a cash-equivalent card: a voucher is
 * offered and agreed afterwards, through the compensation's voucher steps) and queues the written confirmation, all
 * in one transaction. The round row is locked first (FOR UPDATE), then the volunteer, so concurrent accepts queue
 * up: none can take the round past the seats it needs, and a volunteer already accepted is refused. READ COMMITTED:
 * the seat count read after the round lock sees every accept committed before this one got the lock (a repeatable
 * read could answer from a snapshot taken earlier).
 */
export async function acceptVolunteer(db: DataSource, user: SessionUser, roundId: number, volunteerId: number, enqueue: Enqueue = enqueueMessage) {
  for (let attempt = 1; ; attempt++) {
    try {
      return await db.transaction('READ COMMITTED', (em) => acceptInTransaction(em, user, roundId, volunteerId, enqueue));
    } catch (err) {
      if (isRetryable(err) && attempt < 5) continue;
      throw err;
    }
  }
}

async function acceptInTransaction(em: EntityManager, user: SessionUser, roundId: number, volunteerId: number, enqueue: Enqueue) {
  const round = await roundForUser(em, user, roundId, true);
  const { v, agreed, accepted, commonPrice } = await prepareAccept(em, round, volunteerId);
  recordEffect(em, flightChanged(round.flightId, round.stationId, ['rounds']));
  // A posted offer was already through the gate when it was set; a sealed bid's amount is fixed here, by this accept.
  if (round.kind === 'sealed') {
    const gate = await gateAmount(em, user, { kind: 'sealed-accept', stationId: round.stationId, flightId: round.flightId, roundId: round.id, subjectId: v.id, amountMinor: agreed, currency: round.currency });
    if (!gate.approved) return { round, volunteer: v, approvalRequested: true };
    await completeAccept(em, user, user.id, round, v, { agreed, accepted, commonPrice, clearedBy: gate.approval ? `approval ${gate.approval.id}` : `limit of user ${user.id}` }, enqueue);
    return { round, volunteer: v, approvalRequested: false };
  }
  await completeAccept(em, user, user.id, round, v, { agreed, accepted, commonPrice, clearedBy: `offer of round ${round.id}` }, enqueue);
  return { round, volunteer: v, approvalRequested: false };
}

/** Locks the volunteer and checks the round can take them; the round row is locked by the caller. */
async function prepareAccept(em: EntityManager, round: VolunteerRoundEntity, volunteerId: number) {
  if (round.status !== 'open') throw conflict('round_closed', 'This volunteer round is closed.');
  await assertNotDeparted(em, round.flightId, 'accepting a volunteer');
  const v = await em.findOne(VolunteerEntity, { where: { id: volunteerId, roundId: round.id }, lock: { mode: 'pessimistic_write' } });
  if (!v) throw notFound('Volunteer');
  if (v.status !== 'offered') throw conflict('already_decided', `This volunteer is already ${v.status}.`);
  if (round.kind === 'posted' && round.offerMinor === null) throw conflict('awaiting_approval', 'The round’s offer still waits for a supervisor; no one can be accepted before it stands.');
  const accepted = await em.findBy(VolunteerEntity, { roundId: round.id, status: 'accepted' });
  const seatsTaken = accepted.reduce((a, x) => a + x.passengerIds.length, 0);
  if (seatsTaken + v.passengerIds.length > round.volunteersNeeded) {
    throw conflict('round_full', `The round needs ${round.volunteersNeeded} volunteer seat(s) and ${seatsTaken} are taken; this party of ${v.passengerIds.length} does not fit.`);
  }
  const policy = await policyFor(em, round.stationId);
  let agreed = round.kind === 'posted' ? round.offerMinor! : v.askMinor!;
  // Common price: everyone accepted is paid the highest accepted ask, so no one is worse off for asking less.
  if (round.kind === 'sealed' && policy.sealedBidPricing === 'common-price') agreed = Math.max(agreed, ...accepted.map((x) => x.agreedMinor ?? x.askMinor ?? 0));
  return { v, agreed, accepted, commonPrice: round.kind === 'sealed' && policy.sealedBidPricing === 'common-price' };
}

interface Price { agreed: number; accepted: VolunteerEntity[]; commonPrice: boolean; clearedBy: string }

async function completeAccept(em: EntityManager, actor: SessionUser, acceptedBy: number, round: VolunteerRoundEntity, v: VolunteerEntity, { agreed, accepted, commonPrice, clearedBy }: Price, enqueue: Enqueue) {
  if (commonPrice) await liftEarlierVolunteers(em, round, agreed, 'common-price rule', enqueue, accepted);
  Object.assign(v, { status: 'accepted', agreedMinor: agreed, acceptedByUserId: acceptedBy, acceptedAt: new Date() });
  await em.save(v);
  const station = await em.findOneByOrFail(StationEntity, { id: round.stationId });
  for (const passengerId of v.passengerIds) {
    await recordCompensationDue(em, {
      stationId: round.stationId, flightId: round.flightId, bookingId: v.bookingId, passengerId, sourceKind: 'volunteer', sourceId: v.id,
      regime: station.regime, voluntary: true, amountMinor: agreed, currency: round.currency,
      band: round.kind === 'posted' ? 'posted offer' : 'sealed bid', ruleRef: 'agreed with the volunteer',
      explanation: `Volunteered in a ${round.kind === 'posted' ? 'posted-offer' : 'sealed-bid'} round at the agreed amount per seat. Volunteers agree their own benefits.`,
      amountClearedBy: clearedBy,
    });
  }
  const notice = await enqueueConfirmation(em, round, v, enqueue);
  // Accepted volunteers leave the forecast's count of shows.
  recordEffect(em, ...flightMoved(round.flightId, round.stationId, ['rounds', 'forecast']));
  await audit(em, { actor, action: 'volunteer.accepted', entityType: 'volunteer', entityId: v.id, stationId: round.stationId, before: { status: 'offered' }, after: { status: 'accepted', agreedMinor: agreed, currency: round.currency, passengerIds: v.passengerIds, notice } });
}

/**
 * A supervisor approved a sealed bid above the agent's limit: the accept the agent asked for happens now, credited
 * to that agent, unless the amount it would fix changed meanwhile (a common price moved), which needs a new request.
 */
export async function acceptApproved(em: EntityManager, decider: SessionUser, round: VolunteerRoundEntity, approval: OfferApprovalEntity, enqueue: Enqueue = enqueueMessage) {
  const { v, agreed, accepted, commonPrice } = await prepareAccept(em, round, approval.subjectId!);
  if (agreed !== approval.offerMinor) throw conflict('amount_changed', `Accepting this bid now fixes ${agreed} minor units, not the ${approval.offerMinor} asked for; decline this request and ask again.`);
  await completeAccept(em, decider, approval.requestedByUserId, round, v, { agreed, accepted, commonPrice, clearedBy: `approval ${approval.id}` }, enqueue);
}

/** A sealed bid that waited for a supervisor no longer can be accepted as asked: its request is closed, with why. */
export async function dropWaitingAccept(em: EntityManager, volunteerId: number, reason: string) {
  await em.update(OfferApprovalEntity, { kind: 'sealed-accept', subjectId: volunteerId, status: 'pending' }, { status: 'rejected', reason, decidedAt: new Date() });
}

export async function declineVolunteer(db: DataSource, user: SessionUser, roundId: number, volunteerId: number) {
  return db.transaction(async (em) => {
    const round = await roundForUser(em, user, roundId, true);
    const v = await em.findOne(VolunteerEntity, { where: { id: volunteerId, roundId }, lock: { mode: 'pessimistic_write' } });
    if (!v) throw notFound('Volunteer');
    if (v.status !== 'offered') throw conflict('already_decided', `This volunteer is already ${v.status}.`);
    v.status = 'declined';
    await em.save(v);
    await dropWaitingAccept(em, v.id, 'the volunteer was declined');
    recordEffect(em, flightChanged(round.flightId, round.stationId, ['rounds']));
    await audit(em, { actor: user, action: 'volunteer.declined', entityType: 'volunteer', entityId: v.id, stationId: round.stationId, before: { status: 'offered' }, after: { status: 'declined' } });
    return { round, volunteer: v };
  });
}
