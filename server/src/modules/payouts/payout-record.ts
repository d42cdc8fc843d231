// Writing what the provider said about a bank transfer, from its API answer or a webhook, whichever comes first, in
// one transaction with the audit row. A transfer moves forward only: processing → posted → returned, or processing →
// failed. A failed or returned transfer leaves the passenger owed again, with an alert, for a re-issue.
import type { EntityManager } from 'typeorm';
import { CompensationEntity, PayoutEntity, type PayoutState } from '../../db/entities';
import type { OutboundPaymentSnapshot } from '../../integrations/payments/passenger-provider';
import { raisePaymentLost, resolvePaymentAlerts } from '../alerts/alerts.service';
import { audit } from '../audit/audit.service';
import { enqueueMessage } from '../outbox/outbox.service';
import { compensationRow, passengerNameOf } from '../payments/compensation-view';
import type { Actor } from '../payments/issuance-record';
import { flightChanged, recordEffect } from '../../events';
import { transferReceipt } from './payout-notices';

const RANK: Record<PayoutState, number> = { 'awaiting-details': 0, ready: 1, processing: 2, posted: 3, failed: 4, returned: 4 };
const STATUS_TO_STATE: Record<string, PayoutState | undefined> = { processing: 'processing', posted: 'posted', failed: 'failed', returned: 'returned' };

/** The transfer exists at the provider: the payout row names it, the compensation is 'issued', the receipt is queued. */
export async function recordTransferSent(em: EntityManager, attemptKey: string, sent: OutboundPaymentSnapshot, actor: Actor): Promise<void> {
  return applyTransfer(em, attemptKey, { ...sent, status: 'processing' }, actor);
}

/** Applies one provider status for the transfer of this attempt (API answer or webhook). */
export async function applyTransfer(em: EntityManager, attemptKey: string, payment: OutboundPaymentSnapshot, actor: Actor): Promise<void> {
  const payout = await em.findOne(PayoutEntity, { where: { attemptKey }, lock: { mode: 'pessimistic_write' } });
  if (!payout) return;
  const comp = await em.findOne(CompensationEntity, { where: { id: payout.compensationId }, lock: { mode: 'pessimistic_write' } });
  const target = STATUS_TO_STATE[payment.status];
  if (!comp || !target) return;
  // The 'created' news may arrive after 'posted': first make sure 'sent' was recorded, then move on.
  if (RANK[payout.state] < RANK.processing) await markSent(em, payout, comp, payment.id, actor);
  if (RANK[target] <= Math.max(RANK[payout.state], RANK.processing)) return;
  recordEffect(em, flightChanged(comp.flightId, comp.stationId, ['compensations']));
  await em.update(PayoutEntity, { id: payout.id }, { state: target, providerPaymentId: payment.id, claimedBy: null, leaseUntil: null });
  if (target === 'posted') {
    if (comp.state !== 'issued') return;
    await em.update(CompensationEntity, { id: comp.id }, { state: 'settled' });
    await audit(em, { actor, action: 'compensation.settled', entityType: 'compensation', entityId: comp.id, stationId: comp.stationId, before: { state: comp.state }, after: { state: 'settled', medium: 'bank-transfer', providerPaymentId: payment.id, amountMinor: payment.amountMinor, currency: payment.currency } });
    return;
  }
  // failed before it left, or returned by the passenger's bank after it arrived: the passenger is owed again. A
  // compensation finance already voided, or re-issued under a new attempt, keeps its own state.
  if (!['issuing', 'issued', 'settled'].includes(comp.state) || comp.idempotencyKey !== attemptKey) return;
  const reason = target === 'failed' ? 'bank transfer failed at the provider' : `bank transfer returned by the bank (${payment.returnCode ?? 'no code'})`;
  const state = target === 'failed' ? 'failed' : 'canceled';
  await em.update(CompensationEntity, { id: comp.id }, { state, lastError: reason });
  await audit(em, { actor, action: target === 'failed' ? 'compensation.issue_failed' : 'compensation.transfer_returned', entityType: 'compensation', entityId: comp.id, stationId: comp.stationId, before: { state: comp.state }, after: { state, reason, providerPaymentId: payment.id } });
  await raisePaymentLost(em, comp, target === 'failed' ? 'payment-failed' : 'payment-canceled', reason);
}

async function markSent(em: EntityManager, payout: PayoutEntity, comp: CompensationEntity, paymentId: string, actor: Actor): Promise<void> {
  await em.update(PayoutEntity, { id: payout.id }, { state: 'processing', providerPaymentId: paymentId, claimedBy: null, leaseUntil: null, lastError: null });
  if (comp.state !== 'issuing' || comp.idempotencyKey !== payout.attemptKey) return;
  await em.update(CompensationEntity, { id: comp.id }, { state: 'issued', lastError: null });
  comp.state = 'issued';
  await audit(em, { actor, action: 'compensation.issued', entityType: 'compensation', entityId: comp.id, stationId: comp.stationId, before: { state: 'issuing' }, after: { state: 'issued', medium: 'bank-transfer', providerPaymentId: paymentId, amountMinor: comp.amountMinor, currency: comp.currency, accountEnding: payout.accountLast4 } });
  await resolvePaymentAlerts(em, comp.id, `Paid: bank transfer ${paymentId} sent.`);
  recordEffect(em, flightChanged(comp.flightId, comp.stationId, ['compensations']));
  const row = await compensationRow(em, comp.id);
  if (!row.contact_email) return;
  const notice = transferReceipt({ passengerName: passengerNameOf(row), flight: `${row.carrier_code} ${row.flight_number}`, serviceDate: row.service_date, amountMinor: comp.amountMinor, currency: comp.currency, accountEnding: payout.accountLast4, compensationId: comp.id, language: row.booking_language });
  await enqueueMessage(em, { stationId: comp.stationId, flightId: comp.flightId, passengerIds: [comp.passengerId], kind: 'compensation-receipt', to: row.contact_email, subject: notice.subject, text: notice.text, html: notice.html, dedupeKey: `transfer-receipt:${comp.id}:${paymentId}` });
}
