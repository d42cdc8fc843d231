// A compensation paid by bank transfer: the passenger is mailed a payout link, enters their own account on their own
// phone (never a staff screen), the provider keeps it as a payment method (we keep its id and last four digits),
// and the transfer goes out as one Treasury OutboundPayment under a key fixed by the payment attempt. A worker
// claims the row (db/claim-rows) before it calls, so two processes never send the same row at once, and the key
// makes even a lost answer or a crash mid-call resolve to the one payment the provider already made.
import type { EntityManager } from 'typeorm';
import type { BookingProof, PayoutLink } from '@shared/schemas/payouts';
import { CompensationEntity, PayoutEntity } from '../../db/entities';
import { badRequest, conflict, upstreamFailed } from '../../domain/errors';
import { classifyProviderError } from '../../integrations/payments/provider-errors';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { enqueueMessage } from '../outbox/outbox.service';
import { compensationRow, passengerNameOf } from '../payments/compensation-view';
import { recordRefused } from '../payments/issuance-record';
import { PASSENGER_ACTOR, WORKER_ACTOR, type PaymentsContext } from '../payments/payments-context';
import { bookingLanguage, countWrongTry, createLink, findLink, linkState, markUsed, proofMatches, refuseUnlessReady, wrongProof } from './payment-links';
import { payoutLinkNotice } from './payout-notices';
import { transferCurrencyProblem } from './transfer-currencies';
import { recordTransferSent } from './payout-record';

export const transferKey = (attemptKey: string) => `${attemptKey}-transfer`;

/** First step for a row in 'issuing' whose medium is a bank transfer: the payout row and the passenger's link, once. */
async function openPayout(em: EntityManager, ctx: PaymentsContext, compensationId: number): Promise<{ ready: string | null }> {
  const comp = await em.findOne(CompensationEntity, { where: { id: compensationId }, lock: { mode: 'pessimistic_write' } });
  if (!comp || comp.state !== 'issuing' || !comp.idempotencyKey) return { ready: null };
  const existing = await em.findOneBy(PayoutEntity, { attemptKey: comp.idempotencyKey });
  if (existing) return { ready: existing.state === 'ready' ? existing.attemptKey : null };
  const currencyProblem = transferCurrencyProblem(comp.currency);
  if (currencyProblem) {
    await recordRefused(em, comp.id, `bank transfer: ${currencyProblem}`, WORKER_ACTOR);
    return { ready: null };
  }
  const row = await compensationRow(em, comp.id);
  if (!row.contact_email) {
    await recordRefused(em, comp.id, 'bank transfer: the booking has no e-mail address to send the passenger their payout link', WORKER_ACTOR);
    return { ready: null };
  }
  await em.insert(PayoutEntity, { compensationId: comp.id, attemptKey: comp.idempotencyKey, state: 'awaiting-details', amountMinor: comp.amountMinor, currency: comp.currency });
  const link = await createLink(em, ctx, { compensationId: comp.id, purpose: 'payout', attemptKey: comp.idempotencyKey });
  const notice = payoutLinkNotice({
    passengerName: passengerNameOf(row), flight: `${row.carrier_code} ${row.flight_number}`, serviceDate: row.service_date,
    amountMinor: comp.amountMinor, currency: comp.currency, url: link.url, expiresAt: link.expiresAt, compensationId: comp.id,
    language: row.booking_language,
  });
  await enqueueMessage(em, {
    stationId: comp.stationId, flightId: comp.flightId, passengerIds: [comp.passengerId], kind: 'compensation-receipt', to: row.contact_email,
    subject: notice.subject, text: notice.text, html: notice.html, dedupeKey: `payout-link:${comp.id}:${comp.idempotencyKey}`,
  });
  await audit(em, {
    actor: WORKER_ACTOR, action: 'compensation.payout_link_sent', entityType: 'compensation', entityId: comp.id, stationId: comp.stationId,
    before: { state: 'issuing' }, after: { medium: 'bank-transfer', attemptKey: comp.idempotencyKey, linkExpiresAt: link.expiresAt.toISOString() },
  });
  recordEffect(em, flightChanged(comp.flightId, comp.stationId, ['compensations']));
  return { ready: null };
}

/**
 * The claim (db/claim-rows): only one process wins a ready row; a claim past its lease (a dead worker) is free again.
 * The lease is longer than the SDK's timeout with its retries, so a live call is never joined. Resolves with the
 * claim's token, or null when someone else holds the row.
 */
async function claim(ctx: PaymentsContext, attemptKey: string): Promise<string | null> {
  const claimed = await ctx.claims.payouts.claim({ limit: 1, leaseMs: ctx.claims.leaseMs, due: `state = 'ready'`, keys: [attemptKey] });
  return claimed.rows.length === 1 ? claimed.token : null;
}

async function release(ctx: PaymentsContext, token: string, attemptKey: string, reason: string | null): Promise<void> {
  await ctx.claims.payouts.finish(token, attemptKey, 'last_error = ?', [reason]);
}

async function sendTransfer(ctx: PaymentsContext, attemptKey: string): Promise<void> {
  const token = await claim(ctx, attemptKey);
  if (!token) return;
  const payout = await ctx.db.getRepository(PayoutEntity).findOneByOrFail({ attemptKey });
  if (!payout.paymentMethodId) return release(ctx, token, attemptKey, 'no payment method on record');
  const row = await compensationRow(ctx.db, payout.compensationId);
  let sent;
  try {
    sent = await ctx.passenger.createOutboundPayment(
      {
        amountMinor: payout.amountMinor, currency: payout.currency, paymentMethodId: payout.paymentMethodId,
        description: `Compensation C-${payout.compensationId}, flight ${row.carrier_code} ${row.flight_number} ${row.service_date}`,
        metadata: { compensationId: String(payout.compensationId), attemptKey, stationId: String(row.station_id) },
      },
      transferKey(attemptKey),
    );
  } catch (error) {
    const failure = classifyProviderError(error, 'sending the bank transfer');
    if (failure.retryable) return release(ctx, token, attemptKey, failure.reason);
    return ctx.db.transaction(async (em) => {
      await em.update(PayoutEntity, { id: payout.id }, { state: 'failed', claimedBy: null, leaseUntil: null, lastError: failure.reason });
      await recordRefused(em, payout.compensationId, failure.reason, WORKER_ACTOR);
    });
  }
  await ctx.db.transaction((em) => recordTransferSent(em, attemptKey, sent, WORKER_ACTOR));
}

/** One step of a bank-transfer compensation: open it (link mailed), or send it once the passenger's account is in. */
export async function advancePayout(ctx: PaymentsContext, compensationId: number): Promise<void> {
  const opened = await ctx.db.transaction((em) => openPayout(em, ctx, compensationId));
  if (opened.ready) await sendTransfer(ctx, opened.ready);
}

export async function payoutLinkStatus(ctx: PaymentsContext, token: string): Promise<PayoutLink> {
  const link = await findLink(ctx.db.manager, token, 'payout');
  const row = await compensationRow(ctx.db, link.compensationId);
  const payout = await ctx.db.getRepository(PayoutEntity).findOneBy({ attemptKey: link.attemptKey });
  return {
    state: linkState(link, ctx.now()), flight: `${row.carrier_code} ${row.flight_number}`, amountMinor: row.amount_minor, currency: row.currency,
    expiresAt: link.expiresAt.toISOString(), payout: payout ? { state: payout.state, accountEnding: payout.accountLast4 } : null,
    language: bookingLanguage(row.booking_language),
  };
}

export interface AccountDetails {
  holderName: string;
  routingNumber: string;
  accountNumber: string;
  accountType: 'checking' | 'savings';
}

type Submitted = { kind: 'accepted'; compensationId: number; accountEnding: string } | { kind: 'wrong'; triesLeft: number };

/**
 * The passenger's account, from their own phone: handed to the provider as a payment method within the link's lock
 * (so a double tap saves it once), then the link is spent and the row is ready for the worker. The account number
 * is not stored, logged or audited; only its last four digits are.
 */
export async function submitPayoutDetails(ctx: PaymentsContext, token: string, proof: BookingProof, account: AccountDetails): Promise<{ compensationId: number; accountEnding: string }> {
  const outcome = await ctx.db.transaction(async (em): Promise<Submitted> => {
    const link = await findLink(em, token, 'payout', true);
    refuseUnlessReady(link, ctx.now());
    const row = await compensationRow(em, link.compensationId);
    if (!proofMatches(row, proof)) return { kind: 'wrong', triesLeft: await countWrongTry(em, link) };
    const payout = await em.findOne(PayoutEntity, { where: { attemptKey: link.attemptKey }, lock: { mode: 'pessimistic_write' } });
    if (!payout || payout.state !== 'awaiting-details') throw conflict('payout_not_waiting', 'This payment no longer waits for bank details. Please contact the airline if you think this is wrong.');
    let method;
    try {
      method = await ctx.passenger.createBankAccount(
        { holderName: account.holderName, routingNumber: account.routingNumber, accountNumber: account.accountNumber, accountType: account.accountType, metadata: { compensationId: String(payout.compensationId) } },
        `${link.attemptKey}-account-${link.id}`,
      );
    } catch (error) {
      const e = error as Error & { retryable?: boolean; param?: string };
      ctx.log(`[payouts] compensation ${payout.compensationId}: ${e.message}`);
      if (e.retryable === false) {
        const field = e.param?.includes('routing') ? 'routingNumber' : 'accountNumber';
        throw badRequest(`${field}: the bank did not accept this account; please check it`, [{ field, rule: 'the bank did not accept this account; please check it' }]);
      }
      throw upstreamFailed('We could not reach the bank just now. Nothing was saved and your link still works: please try again in a minute.');
    }
    await em.update(PayoutEntity, { id: payout.id }, { state: 'ready', paymentMethodId: method.id, accountLast4: method.last4, lastError: null });
    await markUsed(em, link, ctx.now());
    await audit(em, {
      actor: PASSENGER_ACTOR, action: 'compensation.payout_account_received', entityType: 'compensation', entityId: payout.compensationId, stationId: row.station_id,
      before: { payout: 'awaiting-details' }, after: { payout: 'ready', accountEnding: method.last4, paymentMethodId: method.id, linkId: link.id },
    });
    return { kind: 'accepted', compensationId: payout.compensationId, accountEnding: method.last4 };
  });
  if (outcome.kind === 'wrong') throw wrongProof(outcome.triesLeft);
  return outcome;
}
