// What people do with a compensation's money: an agent issues it, finance voids a payment, and either re-issues
// one that was lost.
// Each decision is recorded (and audited) before the provider is called, so the intent survives any failure.
import type { EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { CompensationEntity, PaymentIssuanceEntity } from '../../db/entities';
import { conflict, notFound, upstreamFailed } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import type { CardSnapshot } from '../../integrations/payments/issuing-provider';
import { classifyProviderError } from '../../integrations/payments/provider-errors';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { raisePaymentLost } from '../alerts/alerts.service';
import { gateIssue } from '../approvals/approval-gate';
import { assertReadyToIssue } from '../agreements/agreement.service';
import { baseKeyFor, REISSUABLE, reissueKeyFor, voidKey } from './compensation-states';
import { spentOnEarlierCards, upsertProviderCard } from './issuance-record';
import type { Issuer } from './issuer';
import type { PaymentsContext } from './payments-context';

/** How long an HTTP request waits for the provider before answering "still issuing" (the worker finishes it). */
export const INLINE_WAIT_MS = 8_000;

async function lockVisible(em: EntityManager, user: SessionUser, id: number): Promise<CompensationEntity> {
  const row = await em.findOne(CompensationEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
  // Another station's compensation is "not found", never a hint that it exists.
  if (!row || !canSeeStation(user, row.stationId)) throw notFound('Compensation');
  return row;
}

/** Remembers the provider account the issuance starts under, in the same transaction as the move to 'issuing'. */
async function rememberAccount(em: EntityManager, ctx: PaymentsContext, compensationId: number): Promise<void> {
  await em.upsert(PaymentIssuanceEntity, { compensationId, providerAccount: ctx.providerAccount, requestedAt: new Date() }, ['compensationId']);
}

function waitBriefly(work: Promise<void>): Promise<void> {
  let timer: NodeJS.Timeout | undefined;
  const pause = new Promise<void>((resolve) => {
    timer = setTimeout(resolve, INLINE_WAIT_MS);
    timer.unref();
  });
  return Promise.race([work, pause]).finally(() => clearTimeout(timer));
}

/**
 * Fixes the idempotency key from the compensation's id and moves it to 'issuing' (audited), then makes one attempt.
 * Asking again for one already issuing or issued changes nothing.
 */
export async function issueCompensation(ctx: PaymentsContext, issuer: Issuer, user: SessionUser, id: number): Promise<void> {
  const started = await ctx.db.transaction(async (em) => {
    const row = await lockVisible(em, user, id);
    if (row.state === 'failed') throw conflict('issue_failed', `The payment provider refused this compensation (${row.lastError ?? 'no reason given'}). It is still owed: re-issue it with a reason.`);
    if (row.state === 'voided') throw conflict('compensation_voided', `The payment was voided (${row.voidReason ?? 'no reason recorded'}). It is still owed: re-issue it with a reason.`);
    if (row.state === 'canceled') throw conflict('payment_canceled', 'The payment provider canceled the card. It is still owed: re-issue it with a reason.');
    if (row.state !== 'due') return row.state === 'issuing';
    if (row.amountMinor <= 0) throw conflict('nothing_to_pay', 'This compensation is for no money; there is nothing to issue.');
    await assertReadyToIssue(em, row);
    if (!(await gateIssue(em, user, row)).approved) {
      // The request is stored (and listed on the station's day); nothing is paid until a supervisor approves it.
      recordEffect(em, flightChanged(row.flightId, row.stationId, ['compensations']));
      return { awaiting: row };
    }
    const key = row.idempotencyKey ?? baseKeyFor(row.id);
    await em.update(CompensationEntity, { id: row.id }, { state: 'issuing', idempotencyKey: key });
    await rememberAccount(em, ctx, row.id);
    await audit(em, { actor: user, action: 'compensation.issue_requested', entityType: 'compensation', entityId: row.id, stationId: row.stationId, before: { state: 'due' }, after: { state: 'issuing', idempotencyKey: key, amountMinor: row.amountMinor, currency: row.currency, form: row.form, medium: row.medium } });
    return true;
  });
  if (typeof started === 'object') {
    throw conflict('awaiting_approval', 'This amount is above your limit: it now waits for a supervisor of the station to approve it. Issue it again once approved.');
  }
  if (started) await waitBriefly(issuer.attempt(id));
}

/**
 * A payment refused, voided or canceled leaves the passenger owed: an agent or finance starts a new attempt under
 * fresh keys, with the reason on record. The earlier card is dead (canceled at the provider, or never made), and
 * what was spent on it is deducted from the new card, so nothing is paid twice.
 */
export async function reissueCompensation(ctx: PaymentsContext, issuer: Issuer, user: SessionUser, id: number, reason: string): Promise<void> {
  await ctx.db.transaction(async (em) => {
    const row = await lockVisible(em, user, id);
    if (!REISSUABLE.includes(row.state)) throw conflict('not_reissuable', `Only a compensation whose payment was refused, voided or canceled can be re-issued; this one is ${row.state}.`);
    if (row.amountMinor <= 0) throw conflict('nothing_to_pay', 'This compensation is for no money; there is nothing to issue.');
    await assertReadyToIssue(em, row);
    const live = await em.query("SELECT card_id FROM provider_cards WHERE compensation_id = ? AND status <> 'canceled'", [row.id]) as { card_id: string }[];
    if (row.state !== 'failed' && live.length) throw conflict('card_still_live', `The provider still lists card ${live[0].card_id} as usable; cancel it before re-issuing.`);
    const spent = await spentOnEarlierCards(em, row.id);
    if (spent >= row.amountMinor) throw conflict('already_paid', 'The passenger already spent the whole amount on an earlier card; nothing is left to pay.');
    const key = reissueKeyFor(row.id, row.idempotencyKey);
    // The earlier card stays in provider_cards for the record; the ledger names the new one once it exists.
    await em.update(CompensationEntity, { id: row.id }, { state: 'issuing', idempotencyKey: key, providerCardId: row.state === 'failed' ? row.providerCardId : null, lastError: null });
    await rememberAccount(em, ctx, row.id);
    await audit(em, { actor: user, action: 'compensation.reissued', entityType: 'compensation', entityId: row.id, stationId: row.stationId, before: { state: row.state, idempotencyKey: row.idempotencyKey, lastError: row.lastError, voidReason: row.voidReason, providerCardId: row.providerCardId }, after: { state: 'issuing', idempotencyKey: key, reason, alreadySpentMinor: spent } });
  });
  await waitBriefly(issuer.attempt(id));
}

async function cancelAtProvider(ctx: PaymentsContext, id: number, cardId: string): Promise<CardSnapshot> {
  try {
    return await ctx.provider.cancelCard(cardId, voidKey(id));
  } catch (error) {
    const failure = classifyProviderError(error, 'canceling the card');
    if (failure.retryable) throw upstreamFailed(`The payment provider did not confirm the cancellation (${failure.reason}). Nothing was voided; try again.`);
    throw conflict('provider_refused', `The payment provider refused to cancel the card: ${failure.reason}`);
  }
}

/**
 * Voids a compensation with a reason. An issued card is canceled at the provider first (status=canceled, which
 * cannot be undone), so the ledger never says voided while the card can still be spent.
 */
export async function voidCompensation(ctx: PaymentsContext, user: SessionUser, id: number, reason: string): Promise<void> {
  const current = await ctx.db.getRepository(CompensationEntity).findOneBy({ id });
  if (!current || !canSeeStation(user, current.stationId)) throw notFound('Compensation');
  if (current.state === 'issuing') throw conflict('issuing', 'The card is being issued right now; void it once it is issued.');
  if (current.state === 'settled') throw conflict('already_spent', 'The passenger has already spent this card; it can no longer be voided.');
  if (current.state === 'voided') throw conflict('already_voided', `Already voided: ${current.voidReason ?? 'no reason recorded'}.`);
  if (current.state === 'canceled') throw conflict('already_canceled', 'The payment provider already canceled this card; the passenger is owed again. Re-issue it instead.');
  const canceled = current.state === 'issued' && current.providerCardId ? await cancelAtProvider(ctx, id, current.providerCardId) : null;
  await ctx.db.transaction(async (em) => {
    const row = await lockVisible(em, user, id);
    if (canceled) await upsertProviderCard(em, canceled, row.id);
    const allowed = canceled ? ['issued', 'settled', 'voided', 'canceled'] : ['due', 'failed'];
    if (!allowed.includes(row.state)) throw conflict('state_changed', `The compensation became ${row.state} meanwhile; look again before voiding.`);
    // A webhook may have recorded the cancellation first; the reason is still finance's to give.
    await em.update(CompensationEntity, { id: row.id }, { state: 'voided', voidReason: reason });
    await audit(em, { actor: user, action: 'compensation.voided', entityType: 'compensation', entityId: row.id, stationId: row.stationId, before: { state: row.state, voidReason: row.voidReason }, after: { state: 'voided', reason, canceledCardId: canceled?.id ?? null } });
    // The denial or the volunteer's agreement still stands: the passenger is owed again, and the station must know.
    await raisePaymentLost(em, row, 'payment-voided', reason);
    recordEffect(em, flightChanged(row.flightId, row.stationId, ['compensations']));
  });
}
