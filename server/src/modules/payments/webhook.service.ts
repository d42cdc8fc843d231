// Applying the provider's webhook events. Each event id is stored once (unique index), so a redelivery is
// acknowledged and ignored; events may also come out of order, so they only ever move a compensation forward
// (Stripe docs, "Receive webhook events": handle duplicates, do not rely on order).
import type Stripe from 'stripe';
import type { EntityManager } from 'typeorm';
import { CompensationEntity } from '../../db/entities';
import { snapshotOf, type CardSnapshot } from '../../integrations/payments/issuing-provider';
import { raisePaymentLost } from '../alerts/alerts.service';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { AWAITING_CARD, isForward } from './compensation-states';
import { recordIssued, upsertProviderCard, type LinkMaker } from './issuance-record';
import { PROVIDER_ACTOR, type PaymentsContext } from './payments-context';
import { outboundSnapshotOf } from '../../integrations/payments/passenger-provider';
import { applyTransfer } from '../payouts/payout-record';

export type WebhookOutcome = { duplicate: true } | { duplicate: false; outcome: string; compensationId: number | null };

interface Applied {
  outcome: string;
  compensationId: number | null;
}

const ignored = (outcome: string, compensationId: number | null = null): Applied => ({ outcome: `ignored: ${outcome}`, compensationId });
const isDuplicateKey = (error: unknown) => (error as { driverError?: { code?: string } })?.driverError?.code === 'ER_DUP_ENTRY';

async function lockCompensation(em: EntityManager, id: number) {
  return em.findOne(CompensationEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
}

/** What the ledger already knows of a card: a card once canceled stays canceled, whatever an older event says. */
async function knownCard(em: EntityManager, cardId: string): Promise<{ status: string; compensation_id: number | null } | undefined> {
  const [known]: { status: string; compensation_id: number | null }[] = await em.query('SELECT status, compensation_id FROM provider_cards WHERE card_id = ?', [cardId]);
  return known;
}

async function applyCard(em: EntityManager, card: CardSnapshot, links: LinkMaker): Promise<Applied> {
  if (card.compensationId === null) return ignored('card without a compensation id');
  const row = await lockCompensation(em, card.compensationId);
  if (!row) {
    await upsertProviderCard(em, card, null);
    return ignored('no such compensation in the ledger', card.compensationId);
  }
  if (row.providerCardId && row.providerCardId !== card.id) {
    await upsertProviderCard(em, card, null);
    return ignored('another card than the ledger names', row.id);
  }
  const known = await knownCard(em, card.id);
  await upsertProviderCard(em, card, row.id);
  const dead = card.status === 'canceled' || known?.status === 'canceled';
  // A card of this compensation that a re-issue replaced: its news belongs to the earlier attempt.
  if (dead && known?.compensation_id === row.id && row.providerCardId !== card.id) return ignored('an earlier card of this compensation, replaced by a re-issue', row.id);
  if (!dead) {
    if (!AWAITING_CARD.includes(row.state)) return ignored(`already ${row.state}`, row.id);
    await recordIssued(em, row.id, card, PROVIDER_ACTOR, links);
    return { outcome: 'issued', compensationId: row.id };
  }
  if (!isForward(row.state, 'canceled')) return ignored(`already ${row.state}`, row.id);
  // Never a silent void: the provider ended the payment, not the debt. The passenger is owed again, with an alert.
  await em.update(CompensationEntity, { id: row.id }, { state: 'canceled', providerCardId: card.id, providerCardholderId: row.providerCardholderId ?? card.cardholderId });
  await audit(em, { actor: PROVIDER_ACTOR, action: 'compensation.canceled_at_provider', entityType: 'compensation', entityId: row.id, stationId: row.stationId, before: { state: row.state }, after: { state: 'canceled', providerCardId: card.id } });
  await raisePaymentLost(em, row, 'payment-canceled', null);
  recordEffect(em, flightChanged(row.flightId, row.stationId, ['compensations']));
  return { outcome: 'canceled', compensationId: row.id };
}

async function applyTransaction(em: EntityManager, transaction: Stripe.Issuing.Transaction, card: CardSnapshot | null, links: LinkMaker): Promise<Applied> {
  const cardId = typeof transaction.card === 'string' ? transaction.card : transaction.card.id;
  if (card) await upsertProviderCard(em, card, card.compensationId);
  await em.query('UPDATE provider_cards SET spent_minor = spent_minor + ? WHERE card_id = ?', [-transaction.amount, cardId]);
  const [known]: { compensation_id: number | null }[] = await em.query('SELECT compensation_id FROM provider_cards WHERE card_id = ?', [cardId]);
  const compensationId = known?.compensation_id ?? card?.compensationId ?? null;
  if (compensationId === null) return ignored('spend on a card that pays no known compensation');
  const row = await lockCompensation(em, compensationId);
  if (!row) return ignored('no such compensation in the ledger', compensationId);
  // The spend may arrive before any news of the card itself: record the card first, receipt included.
  if (AWAITING_CARD.includes(row.state) && card) await recordIssued(em, row.id, card, PROVIDER_ACTOR, links);
  const current = await em.findOneByOrFail(CompensationEntity, { id: row.id });
  if (!isForward(current.state, 'settled')) return ignored(`already ${current.state}`, row.id);
  await em.update(CompensationEntity, { id: row.id }, { state: 'settled', providerCardId: current.providerCardId ?? cardId });
  await audit(em, { actor: PROVIDER_ACTOR, action: 'compensation.settled', entityType: 'compensation', entityId: row.id, stationId: row.stationId, before: { state: current.state }, after: { state: 'settled', spentMinor: -transaction.amount, currency: transaction.currency.toUpperCase(), transactionId: transaction.id } });
  recordEffect(em, flightChanged(row.flightId, row.stationId, ['compensations']));
  return { outcome: 'settled', compensationId: row.id };
}

/** A bank transfer's news: its metadata names the payment attempt (the payout row) it belongs to. */
async function applyOutbound(em: EntityManager, payment: Stripe.Treasury.OutboundPayment): Promise<Applied> {
  const snapshot = outboundSnapshotOf(payment);
  const attemptKey = payment.metadata?.attemptKey;
  if (!attemptKey) return ignored('transfer without an attempt key', snapshot.compensationId);
  await applyTransfer(em, attemptKey, snapshot, PROVIDER_ACTOR);
  return { outcome: `transfer ${payment.status}`, compensationId: snapshot.compensationId };
}

/** For a spend on a card we have not heard of yet, the card itself says which compensation it pays. */
async function cardBehind(ctx: PaymentsContext, event: Stripe.Event): Promise<CardSnapshot | null> {
  if (event.type !== 'issuing_transaction.created') return null;
  const transaction = event.data.object as Stripe.Issuing.Transaction;
  const cardId = typeof transaction.card === 'string' ? transaction.card : transaction.card.id;
  const [known]: { compensation_id: number | null }[] = await ctx.db.query('SELECT compensation_id FROM provider_cards WHERE card_id = ?', [cardId]);
  if (known?.compensation_id) return null;
  return ctx.provider.retrieveCard(cardId);
}

function objectIdOf(event: Stripe.Event): string | null {
  const id = (event.data.object as { id?: unknown }).id;
  return typeof id === 'string' ? id.slice(0, 64) : null;
}

/** Stores and applies one verified event in one transaction; a failure leaves nothing, so the provider's retry applies it. */
export async function receiveProviderEvent(ctx: PaymentsContext, event: Stripe.Event): Promise<WebhookOutcome> {
  const seen: { n: number }[] = await ctx.db.query('SELECT 1 AS n FROM provider_events WHERE event_id = ?', [event.id]);
  if (seen.length) return { duplicate: true };
  const card = await cardBehind(ctx, event);
  const result = await ctx.db.transaction(async (em): Promise<Applied | null> => {
    try {
      await em.query('INSERT INTO provider_events (event_id, type, object_id, outcome, provider_created) VALUES (?, ?, ?, ?, ?)', [event.id, event.type, objectIdOf(event), 'received', event.created]);
    } catch (error) {
      if (isDuplicateKey(error)) return null;
      throw error;
    }
    let applied: Applied;
    switch (event.type) {
      case 'issuing_card.created':
      case 'issuing_card.updated':
        applied = await applyCard(em, snapshotOf(event.data.object as Stripe.Issuing.Card), ctx);
        break;
      case 'issuing_transaction.created':
        applied = await applyTransaction(em, event.data.object as Stripe.Issuing.Transaction, card, ctx);
        break;
      case 'treasury.outbound_payment.created':
      case 'treasury.outbound_payment.posted':
      case 'treasury.outbound_payment.failed':
      case 'treasury.outbound_payment.returned':
        applied = await applyOutbound(em, event.data.object as Stripe.Treasury.OutboundPayment);
        break;
      default:
        applied = ignored(`type ${event.type} changes nothing in the ledger`);
    }
    await em.query('UPDATE provider_events SET outcome = ?, compensation_id = ? WHERE event_id = ?', [applied.outcome.slice(0, 120), applied.compensationId, event.id]);
    return applied;
  });
  if (!result) return { duplicate: true };
  return { duplicate: false, outcome: result.outcome, compensationId: result.compensationId };
}
