// Creating what a passenger is owed, inside the transaction of the decision that causes it (an accepted volunteer,
// an authorized denial), one row per passenger. The unique source key makes a repeat of the same decision a no-op.
import type { EntityManager } from 'typeorm';
import { CompensationEntity } from '../../db/entities';
import { conflict } from '../../http/errors';

/**
 * How the money reaches the passenger: a prepaid card usable like cash unless the passenger agreed to a travel
 * voucher instead. For denied passengers 14 CFR 250.5(c) and Reg. 261/2004 Art. 7(3) make a voucher the passenger's
 * choice (from memory); volunteers get the same choice (common practice).
 */
export type PaymentTerms = { form: 'prepaid-card' } | { form: 'voucher'; agreedAt: Date };

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
  /** Omitted: the cash-equivalent card. */
  payment?: PaymentTerms;
}

/**
 * The caller holds the lock on the source row (the volunteer or the denial), so no other transaction can be adding
 * the same fact at the same time; the unique key is the backstop if one ever did.
 */
export async function recordCompensationDue(em: EntityManager, fact: CompensationFact): Promise<CompensationEntity> {
  const { payment = { form: 'prepaid-card' }, ...rest } = fact;
  const existing = await em.findOneBy(CompensationEntity, { sourceKind: fact.sourceKind, sourceId: fact.sourceId, passengerId: fact.passengerId });
  if (existing) return existing;
  return em.save(em.create(CompensationEntity, {
    ...rest,
    form: payment.form,
    voucherAgreedAt: payment.form === 'voucher' ? payment.agreedAt : null,
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
