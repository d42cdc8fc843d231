// Canada: when the passenger's real arrival is later than the band paid, the difference is owed as a compensation of
// its own (a top-up), due from the moment the real arrival is recorded. A later report of a longer delay moves a
// top-up not yet paid; nothing paid is ever changed.
import type { DataSource } from 'typeorm';
import { apprTopUp, CA_PAYMENT_HOURS, type ApprBand } from '@shared/compensation';
import type { SessionUser } from '@shared/schemas/auth';
import { CompensationEntity } from '../../db/entities';
import { badRequest, conflict } from '../../domain/errors';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { lockCompensation } from '../agreements/payment-facts';

const BANDS: readonly string[] = ['ca-under-6h', 'ca-6h-to-9h', 'ca-9h-or-more'];

export async function recordActualArrival(db: DataSource, user: SessionUser, id: number, actualDelayMinutes: number, now = new Date()): Promise<CompensationEntity | null> {
  return db.transaction(async (em) => {
    const base = await lockCompensation(em, user, id);
    if (base.regime !== 'ca-appr' || base.voluntary || base.sourceKind !== 'denial' || !BANDS.includes(base.band)) {
      throw conflict('no_top_up', 'Only a Canadian denied-boarding compensation paid by arrival band can be topped up.');
    }
    let top;
    try {
      top = apprTopUp(base.band as ApprBand, actualDelayMinutes, base.createdAt.toISOString().slice(0, 10));
    } catch (error) {
      throw badRequest((error as Error).message, [{ field: 'arrivalDelayMinutes', rule: 'whole minutes, 0 or more' }]);
    }
    const existing = await em.findOne(CompensationEntity, { where: { sourceKind: 'top-up', sourceId: base.id, passengerId: base.passengerId }, lock: { mode: 'pessimistic_write' } });
    await audit(em, { actor: user, action: 'compensation.actual_arrival_recorded', entityType: 'compensation', entityId: base.id, stationId: base.stationId, after: { actualDelayMinutes, paidBand: top.paidBand, actualBand: top.actualBand, topUpMinor: top.topUpMinor } });
    if (top.topUpMinor <= 0) return existing;
    // Our reading, no outside source: the top-up is paid within the same 48 h, counted from when the arrival is known.
    const dueBy = new Date(now.getTime() + CA_PAYMENT_HOURS * 3_600_000);
    if (existing) {
      if (existing.amountMinor >= top.topUpMinor) return existing;
      if (existing.state !== 'due') throw conflict('top_up_paid', 'A top-up was already paid or is being paid; record the rest with finance.');
      await em.update(CompensationEntity, { id: existing.id }, { amountMinor: top.topUpMinor, band: top.actualBand, explanation: top.explanation, dueBy });
      await audit(em, { actor: user, action: 'compensation.top_up_changed', entityType: 'compensation', entityId: existing.id, stationId: base.stationId, before: { amountMinor: existing.amountMinor }, after: { amountMinor: top.topUpMinor, band: top.actualBand } });
      recordEffect(em, flightChanged(base.flightId, base.stationId, ['compensations']));
      return em.findOneByOrFail(CompensationEntity, { id: existing.id });
    }
    const row = await em.save(em.create(CompensationEntity, {
      stationId: base.stationId, flightId: base.flightId, bookingId: base.bookingId, passengerId: base.passengerId, sourceKind: 'top-up', sourceId: base.id,
      regime: base.regime, voluntary: false, amountMinor: top.topUpMinor, currency: top.currency, band: top.actualBand, ruleRef: 'SOR/2019-150 s. 20',
      explanation: top.explanation, amountClearedBy: 'rule', form: 'prepaid-card', medium: 'cash', dueBy, dueRuleRef: 'SOR/2019-150 s. 20 (top-up)', voucherAgreedAt: null,
      state: 'due', idempotencyKey: null, providerCardholderId: null, providerCardId: null, lastError: null, voidReason: null,
    }));
    recordEffect(em, flightChanged(base.flightId, base.stationId, ['compensations']));
    await audit(em, { actor: user, action: 'compensation.top_up_created', entityType: 'compensation', entityId: row.id, stationId: base.stationId, after: { topUpOf: base.id, amountMinor: row.amountMinor, currency: row.currency, band: top.actualBand, dueBy: dueBy.toISOString() } });
    return row;
  });
}
