// Volunteers accepted earlier in a round, when the amount for the round rises after them: a sealed-bid round at a
// common price, or a posted offer raised under the station's default raise policy. Each is lifted to the new
// amount, told in writing, and audited; compensation rows still due follow the new amount.
import type { EntityManager } from 'typeorm';
import { VolunteerEntity, type VolunteerRoundEntity } from '../../db/entities';
import { repriceVolunteerCompensation } from '../compensations/compensation-due';
import { audit } from '../audit/audit.service';
import { enqueueMessage } from '../outbox/outbox.service';
import { enqueueConfirmation, type Enqueue } from './volunteer-notices';

/** Why the amount moved, recorded as the audit row's actor (the rule, not a person, changed what they are owed). */
export type LiftReason = 'common-price rule' | 'raise policy: earlier volunteers get the new offer';

export async function liftEarlierVolunteers(em: EntityManager, round: VolunteerRoundEntity, amountMinor: number, reason: LiftReason, enqueue: Enqueue = enqueueMessage, accepted?: VolunteerEntity[]) {
  const earlier = accepted ?? (await em.find(VolunteerEntity, { where: { roundId: round.id, status: 'accepted' }, lock: { mode: 'pessimistic_write' } }));
  for (const x of earlier) {
    if (x.agreedMinor !== null && x.agreedMinor >= amountMinor) continue;
    await repriceVolunteerCompensation(em, x.id, amountMinor);
    const before = x.agreedMinor;
    x.agreedMinor = amountMinor;
    await em.update(VolunteerEntity, { id: x.id }, { agreedMinor: amountMinor });
    const notice = await enqueueConfirmation(em, round, x, enqueue, true);
    await audit(em, { actor: { label: reason }, action: 'volunteer.repriced', entityType: 'volunteer', entityId: x.id, stationId: round.stationId, before: { agreedMinor: before }, after: { agreedMinor: amountMinor, currency: round.currency, notice } });
  }
}
