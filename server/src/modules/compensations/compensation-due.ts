// Creating what a passenger is owed, inside the transaction of the decision that causes it (an accepted volunteer,
// an authorized denial), one row per passenger. The unique source key makes a repeat of the same decision a no-op.
import type { EntityManager } from 'typeorm';
import { CompensationEntity } from '../../db/entities';
import { conflict } from '../../domain/errors';
import { flightChanged, recordEffect } from '../../events';
import { recordRefundsDue } from '../refunds/refunds-due';
import { insertDue, type CompensationFact } from './insert-due';

export type { CompensationFact };

/**
 * Paid first in the rule's lawful default medium (cash for a denial; the card a volunteer accepted), with the rule's
 * deadline counted from now, the moment of the decision; a card or credit replaces money only with the passenger's
 * recorded agreement (the agreements module). The caller holds the lock on the
 * source row (the volunteer or the denial), so no other transaction adds the same fact at the same time; the unique
 * key is the backstop if one ever did.
 */
export async function recordCompensationDue(em: EntityManager, fact: CompensationFact): Promise<CompensationEntity> {
  const existing = await em.findOneBy(CompensationEntity, { sourceKind: fact.sourceKind, sourceId: fact.sourceId, passengerId: fact.passengerId });
  if (existing) return existing;
  const saved = await insertDue(em, fact);
  recordEffect(em, flightChanged(fact.flightId, fact.stationId, ['compensations']));
  // The refunds the rule adds (fees not received, a recorded downgrade) become due in the same transaction.
  if (fact.sourceKind === 'denial' || fact.sourceKind === 'volunteer') await recordRefundsDue(em, saved);
  return saved;
}

/**
 * Sealed bids at a common price: every accepted volunteer's amount follows the price. Only rows still 'due' can
 * follow it; once a payment has started (or failed, with its idempotency key fixed), the amount is settled, and
 * raising the price would owe that volunteer more than is being paid, so the caller is refused instead.
 */
export async function repriceVolunteerCompensation(em: EntityManager, volunteerId: number, amountMinor: number): Promise<void> {
  const rows = await em.find(CompensationEntity, { where: { sourceKind: 'volunteer', sourceId: volunteerId }, lock: { mode: 'pessimistic_write' } });
  const settled = rows.filter((r) => r.state !== 'due' && r.state !== 'voided' && r.amountMinor !== amountMinor);
  if (settled.length) {
    throw conflict('price_locked', `An earlier volunteer of this common-price round is already being paid ${settled[0].amountMinor} ${settled[0].currency}; accepting a higher ask would change what they are owed.`);
  }
  await em.update(CompensationEntity, { sourceKind: 'volunteer', sourceId: volunteerId, state: 'due' }, { amountMinor });
  if (rows.length) recordEffect(em, flightChanged(rows[0].flightId, rows[0].stationId, ['compensations']));
}
