// Creating what a passenger is owed, inside the transaction of the decision that causes it (an accepted volunteer,
// an authorized denial), one row per passenger. The unique source key makes a repeat of the same decision a no-op.
import type { EntityManager } from 'typeorm';
import { CompensationEntity, StationEntity } from '../../db/entities';
import { conflict } from '../../http/errors';
import { termsFor } from '../payments/voucher-rules';

export interface CompensationFact {
  stationId: number;
  flightId: number;
  bookingId: number;
  passengerId: number;
  sourceKind: 'volunteer' | 'denial';
  sourceId: number;
  regime: string;
  voluntary: boolean;
  amountMinor: number;
  currency: string;
  band: string;
  ruleRef: string;
  explanation: string;
  /** How the amount was cleared against a limit; a denial's amount is the rule's (its authorization is a supervisor's). */
  amountClearedBy?: string | null;
}

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
  const station = await em.findOneByOrFail(StationEntity, { id: fact.stationId });
  const terms = termsFor({ regime: fact.regime, voluntary: fact.voluntary, deniedAt: new Date(), timeZone: station.timeZone });
  const medium = terms.media[0];
  return em.save(em.create(CompensationEntity, {
    ...fact,
    amountClearedBy: fact.amountClearedBy ?? (fact.sourceKind === 'denial' ? 'rule' : null),
    form: medium === 'travel-credit' ? 'voucher' : 'prepaid-card',
    medium,
    dueBy: terms.dueBy ? new Date(terms.dueBy) : null,
    dueRuleRef: terms.ruleRef,
    voucherAgreedAt: null,
    state: 'due',
    idempotencyKey: null,
    providerCardholderId: null,
    providerCardId: null,
    lastError: null,
    voidReason: null,
  }));
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
}
