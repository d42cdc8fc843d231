// One payment row for what a passenger is owed, in the rule's lawful default medium with its deadline. Used by the
// compensation of a decision and by the refunds the rule adds to it.
import type { EntityManager } from 'typeorm';
import { CompensationEntity, StationEntity } from '../../db/entities';
import { termsFor } from '../payments/voucher-rules';

export interface CompensationFact {
  stationId: number;
  flightId: number;
  bookingId: number;
  passengerId: number;
  sourceKind: 'volunteer' | 'denial' | 'fee-refund' | 'cabin-refund';
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

/** One payment row in the rule's default medium; also the payment row of a refund. */
export async function insertDue(em: EntityManager, fact: CompensationFact): Promise<CompensationEntity> {
  const station = await em.findOneByOrFail(StationEntity, { id: fact.stationId });
  const terms = termsFor({ regime: fact.regime, voluntary: fact.voluntary, deniedAt: new Date(), timeZone: station.timeZone });
  const medium = terms.media[0];
  return em.save(em.create(CompensationEntity, {
    ...fact,
    amountClearedBy: fact.amountClearedBy ?? (fact.sourceKind === 'volunteer' ? null : 'rule'),
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

