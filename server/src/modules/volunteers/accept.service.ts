import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { StationEntity, VolunteerEntity, type VolunteerRoundEntity } from '../../db/entities';
import { recordCompensationDue, repriceVolunteerCompensation } from '../compensations/compensation-due';
import { conflict, notFound } from '../../http/errors';
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
  if (round.status !== 'open') throw conflict('round_closed', 'This volunteer round is closed.');
  const v = await em.findOne(VolunteerEntity, { where: { id: volunteerId, roundId }, lock: { mode: 'pessimistic_write' } });
  if (!v) throw notFound('Volunteer');
  if (v.status !== 'offered') throw conflict('already_decided', `This volunteer is already ${v.status}.`);
  const accepted = await em.findBy(VolunteerEntity, { roundId, status: 'accepted' });
  const seatsTaken = accepted.reduce((a, x) => a + x.passengerIds.length, 0);
  if (seatsTaken + v.passengerIds.length > round.volunteersNeeded) {
    throw conflict('round_full', `The round needs ${round.volunteersNeeded} volunteer seat(s) and ${seatsTaken} are taken; this party of ${v.passengerIds.length} does not fit.`);
  }
  const policy = await policyFor(em, round.stationId);
  let agreed = round.kind === 'posted' ? round.offerMinor! : v.askMinor!;
  if (round.kind === 'sealed' && policy.sealedBidPricing === 'common-price') {
    // Everyone accepted is paid the highest accepted ask, so no one is worse off for asking less.
    agreed = Math.max(agreed, ...accepted.map((x) => x.agreedMinor ?? x.askMinor ?? 0));
    await raiseEarlierVolunteers(em, round, accepted, agreed, enqueue);
  }
  Object.assign(v, { status: 'accepted', agreedMinor: agreed, acceptedByUserId: user.id, acceptedAt: new Date() });
  await em.save(v);
  const station = await em.findOneByOrFail(StationEntity, { id: round.stationId });
  for (const passengerId of v.passengerIds) {
    await recordCompensationDue(em, {
      stationId: round.stationId, flightId: round.flightId, bookingId: v.bookingId, passengerId, sourceKind: 'volunteer', sourceId: v.id,
      regime: station.regime, voluntary: true, amountMinor: agreed, currency: round.currency,
      band: round.kind === 'posted' ? 'posted offer' : 'sealed bid', ruleRef: 'agreed with the volunteer',
      explanation: `Volunteered in a ${round.kind === 'posted' ? 'posted-offer' : 'sealed-bid'} round at the agreed amount per seat. Volunteers agree their own benefits.`,
    });
  }
  const notice = await enqueueConfirmation(em, round, v, enqueue);
  await audit(em, { actor: user, action: 'volunteer.accepted', entityType: 'volunteer', entityId: v.id, stationId: round.stationId, before: { status: 'offered' }, after: { status: 'accepted', agreedMinor: agreed, currency: round.currency, passengerIds: v.passengerIds, notice } });
  return { round, volunteer: v };
}

/** A common price that rises lifts every earlier accepted volunteer to it, and tells them so in writing. */
async function raiseEarlierVolunteers(em: EntityManager, round: VolunteerRoundEntity, accepted: VolunteerEntity[], agreed: number, enqueue: Enqueue) {
  for (const x of accepted) {
    if (x.agreedMinor === agreed) continue;
    await repriceVolunteerCompensation(em, x.id, agreed);
    const before = x.agreedMinor;
    x.agreedMinor = agreed;
    await em.update(VolunteerEntity, { id: x.id }, { agreedMinor: agreed });
    const notice = await enqueueConfirmation(em, round, x, enqueue, true);
    await audit(em, { actor: { label: 'common-price rule' }, action: 'volunteer.repriced', entityType: 'volunteer', entityId: x.id, stationId: round.stationId, before: { agreedMinor: before }, after: { agreedMinor: agreed, notice } });
  }
}

export async function declineVolunteer(db: DataSource, user: SessionUser, roundId: number, volunteerId: number) {
  return db.transaction(async (em) => {
    const round = await roundForUser(em, user, roundId, true);
    const v = await em.findOne(VolunteerEntity, { where: { id: volunteerId, roundId }, lock: { mode: 'pessimistic_write' } });
    if (!v) throw notFound('Volunteer');
    if (v.status !== 'offered') throw conflict('already_decided', `This volunteer is already ${v.status}.`);
    v.status = 'declined';
    await em.save(v);
    await audit(em, { actor: user, action: 'volunteer.declined', entityType: 'volunteer', entityId: v.id, stationId: round.stationId, before: { status: 'offered' }, after: { status: 'declined' } });
    return { round, volunteer: v };
  });
}
