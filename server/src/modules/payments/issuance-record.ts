// Writing what the provider answered: a card issued (from the API answer or a webhook, whichever comes first),
// a refusal, or the provider's view of a card. All inside one transaction with its audit row and the receipt.
import type { EntityManager } from 'typeorm';
import { CompensationEntity, VoucherOfferEntity } from '../../db/entities';
import type { CardSnapshot } from '../../integrations/payments/issuing-provider';
import { resolvePaymentAlerts, raisePaymentLost } from '../alerts/alerts.service';
import { flightChanged, recordEffect } from '../../events';
import { audit, type AuditEntry } from '../audit/audit.service';
import { enqueueMessage } from '../outbox/outbox.service';
import { AWAITING_CARD } from './compensation-states';
import { compensationRow, passengerNameOf } from './compensation-view';
import { compensationReceipt } from './payment-notices';
import { createLink } from '../payouts/payment-links';
import type { PaymentsContext } from './payments-context';

export type Actor = AuditEntry['actor'];

/** What making a passenger's card-details link needs: the app's address and the clock. */
export type LinkMaker = Pick<PaymentsContext, 'appBaseUrl' | 'now'>;

/** Keeps the provider's last word on a card. A canceled card stays canceled whatever an older answer said. */
export async function upsertProviderCard(em: EntityManager, card: CardSnapshot, compensationId: number | null): Promise<void> {
  await em.query(
    `INSERT INTO provider_cards (card_id, compensation_id, cardholder_id, status, currency, limit_minor, spent_minor, last4, exp_month, exp_year)
     VALUES (?, ?, ?, ?, ?, ?, 0, ?, ?, ?)
     ON DUPLICATE KEY UPDATE
       compensation_id = COALESCE(compensation_id, VALUES(compensation_id)),
       cardholder_id = COALESCE(VALUES(cardholder_id), cardholder_id),
       status = IF(status = 'canceled', status, VALUES(status)),
       currency = VALUES(currency), limit_minor = VALUES(limit_minor),
       last4 = COALESCE(VALUES(last4), last4), exp_month = COALESCE(VALUES(exp_month), exp_month), exp_year = COALESCE(VALUES(exp_year), exp_year)`,
    [card.id, compensationId, card.cardholderId, card.status, card.currency, card.limitMinor, card.last4, card.expMonth, card.expYear],
  );
}

/** What the passenger already spent on this compensation's cards other than the one the ledger names now. */
export async function spentOnEarlierCards(em: EntityManager, compensationId: number, currentCardId: string | null = null): Promise<number> {
  const [row]: { spent: string | number | null }[] = await em.query(
    'SELECT COALESCE(SUM(spent_minor), 0) AS spent FROM provider_cards WHERE compensation_id = ? AND (? IS NULL OR card_id <> ?)',
    [compensationId, currentCardId, currentCardId],
  );
  return Number(row?.spent ?? 0);
}

async function enqueueReceipt(em: EntityManager, compensationId: number, attemptKey: string | null, card: CardSnapshot, links: LinkMaker): Promise<boolean> {
  const row = await compensationRow(em, compensationId);
  if (!row.contact_email) return false;
  const details = attemptKey ? await createLink(em, links, { compensationId, purpose: 'card-details', attemptKey }) : null;
  const offer = row.form === 'voucher' ? await em.findOneBy(VoucherOfferEntity, { compensationId }) : null;
  const notice = compensationReceipt({
    passengerName: passengerNameOf(row),
    flight: `${row.carrier_code} ${row.flight_number}`,
    serviceDate: row.service_date,
    stationName: row.station_name,
    amountMinor: row.amount_minor,
    currency: row.currency,
    form: row.form,
    last4: card.last4,
    expiry: card.expMonth && card.expYear ? `${String(card.expMonth).padStart(2, '0')}/${card.expYear}` : null,
    restrictions: offer?.restrictions ?? [],
    compensationId,
    details,
    language: row.booking_language,
  });
  await enqueueMessage(em, {
    stationId: row.station_id,
    flightId: row.flight_id,
    passengerIds: [row.passenger_id],
    kind: 'compensation-receipt',
    to: row.contact_email,
    subject: notice.subject,
    text: notice.text,
    html: notice.html,
    // Once per card: a re-issued compensation's new card gets its own receipt.
    dedupeKey: `compensation-receipt:${compensationId}:${card.id}`,
  });
  return true;
}

/**
 * The card exists at the provider: 'issued' with its ids, audited, and the receipt queued (once: the outbox's
 * dedupe key). A row already past 'issuing' keeps its state; it only learns ids it lacked.
 */
export async function recordIssued(em: EntityManager, compensationId: number, card: CardSnapshot, actor: Actor, links: LinkMaker): Promise<void> {
  const row = await em.findOne(CompensationEntity, { where: { id: compensationId }, lock: { mode: 'pessimistic_write' } });
  if (!row) return;
  await upsertProviderCard(em, card, compensationId);
  if (!AWAITING_CARD.includes(row.state)) {
    if (!row.providerCardId) await em.update(CompensationEntity, { id: row.id }, { providerCardId: card.id, providerCardholderId: row.providerCardholderId ?? card.cardholderId });
    return;
  }
  const before = { state: row.state, providerCardId: row.providerCardId, lastError: row.lastError };
  await em.update(CompensationEntity, { id: row.id }, { state: 'issued', providerCardId: card.id, providerCardholderId: card.cardholderId ?? row.providerCardholderId, lastError: null });
  await audit(em, {
    actor, action: 'compensation.issued', entityType: 'compensation', entityId: row.id, stationId: row.stationId,
    before, after: { state: 'issued', providerCardId: card.id, amountMinor: row.amountMinor, currency: row.currency, form: row.form },
  });
  await resolvePaymentAlerts(em, row.id, `Paid: card ${card.id} issued.`);
  await enqueueReceipt(em, row.id, row.idempotencyKey, card, links);
  recordEffect(em, flightChanged(row.flightId, row.stationId, ['compensations']));
}

/** The provider refused the request itself: 'failed' with its reason, for finance to look at and re-issue. */
export async function recordRefused(em: EntityManager, compensationId: number, reason: string, actor: Actor): Promise<void> {
  const row = await em.findOne(CompensationEntity, { where: { id: compensationId }, lock: { mode: 'pessimistic_write' } });
  if (!row || row.state !== 'issuing') return;
  await em.update(CompensationEntity, { id: row.id }, { state: 'failed', lastError: reason });
  await audit(em, { actor, action: 'compensation.issue_failed', entityType: 'compensation', entityId: row.id, stationId: row.stationId, before: { state: 'issuing' }, after: { state: 'failed', reason } });
  await raisePaymentLost(em, row, 'payment-failed', reason);
  recordEffect(em, flightChanged(row.flightId, row.stationId, ['compensations']));
}
