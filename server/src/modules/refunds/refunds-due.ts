// The refunds a rule adds to a denied passenger's compensation, recorded in the transaction that makes the
// compensation due (or that records the downgrade, when it comes later): one rule_refunds row per kind, each with its
// own payment row, so the desk pays it through the same media and idempotency as the compensation.
import type { EntityManager } from 'typeorm';
import { REFUND_SOURCE_KINDS } from '@shared/schemas/refunds';
import type { RegimeCode } from '@shared/schemas/common';
import { CabinChangeEntity, CompensationEntity, PassengerEntity, RuleRefundEntity } from '../../db/entities';
import { audit } from '../audit/audit.service';
import { insertDue } from '../compensations/insert-due';
import { refundsDue } from './refund-rules';

/** What a refund's ruleRef column holds at most; the full rule text is on the refund row. */
const PAYMENT_RULE_REF_MAX = 120;

/**
 * For a compensation of a denial or a volunteer: the refunds its rule adds, each created once (the payment row's unique
 * source key and the refund's unique payment id make a repeat a no-op).
 */
export async function recordRefundsDue(em: EntityManager, base: CompensationEntity): Promise<void> {
  if (base.sourceKind !== 'denial' && base.sourceKind !== 'volunteer') return;
  const passenger = await em.findOneByOrFail(PassengerEntity, { id: base.passengerId });
  const cabinChange = await em.findOneBy(CabinChangeEntity, { flightId: base.flightId, passengerId: base.passengerId });
  const due = refundsDue({ regime: base.regime as RegimeCode, fareCurrency: passenger.fareCurrency, fees: passenger.optionalFees ?? [], cabinChange });
  for (const r of due) {
    const sourceKind = REFUND_SOURCE_KINDS[r.kind];
    if (await em.existsBy(CompensationEntity, { sourceKind, sourceId: base.id, passengerId: base.passengerId })) continue;
    const payment = await insertDue(em, {
      stationId: base.stationId, flightId: base.flightId, bookingId: base.bookingId, passengerId: base.passengerId, sourceKind, sourceId: base.id,
      regime: base.regime, voluntary: base.voluntary, amountMinor: r.amountMinor, currency: r.currency, band: 'refund',
      ruleRef: r.ruleRef.slice(0, PAYMENT_RULE_REF_MAX),
      explanation: `Refund the rule adds to compensation ${base.id}: ${r.lines.map((l) => `${l.label} ${l.amountMinor}`).join(', ')} (minor units, ${r.currency}).`,
      amountClearedBy: 'rule',
    });
    const refund = await em.save(em.create(RuleRefundEntity, {
      stationId: base.stationId, flightId: base.flightId, passengerId: base.passengerId, baseCompensationId: base.id, paymentCompensationId: payment.id,
      cabinChangeId: r.cabinChangeId, kind: r.kind, amountMinor: r.amountMinor, currency: r.currency, ruleRef: r.ruleRef, lines: r.lines,
    }));
    await audit(em, {
      actor: { label: 'rules' }, action: 'refund.due', entityType: 'rule_refund', entityId: refund.id, stationId: base.stationId,
      after: { kind: r.kind, passengerId: base.passengerId, compensationId: base.id, paymentCompensationId: payment.id, amountMinor: r.amountMinor, currency: r.currency, ruleRef: r.ruleRef, lines: r.lines },
    });
  }
}

/** A downgrade recorded after the passenger's compensation: its refund becomes due now, beside that compensation. */
export async function refundsAfterCabinChange(em: EntityManager, flightId: number, passengerId: number): Promise<void> {
  const bases = await em.find(CompensationEntity, { where: [{ flightId, passengerId, sourceKind: 'denial' }, { flightId, passengerId, sourceKind: 'volunteer' }] });
  for (const base of bases) await recordRefundsDue(em, base);
}
