// The passenger's single-use, short-lived links. The token is 32 random bytes, carried only by the e-mail; the
// database keeps its SHA-256, so neither a database reader nor a log line can open a link. A link is spent when it
// has done its one job (card details shown, bank account taken), expires on the clock, and locks after a few wrong
// booking proofs, so someone else holding the link cannot try their way in.
import { createHash, randomBytes } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import type { BookingProof } from '@shared/schemas/payouts';
import { isLanguage, type Language } from '@shared/i18n/languages';
import { PaymentLinkEntity, type PaymentLinkPurpose } from '../../db/entities';
import { DomainError, forbidden, gone, locked } from '../../domain/errors';
import type { CompensationRow } from '../payments/compensation-view';
import type { PaymentsContext } from '../payments/payments-context';

/**
 * A card-details link lives a day and a payout link three days: long enough for a passenger who reads mail after
 * landing, short enough that an old mailbox holds nothing usable (our own choice; common practice for one-time
 * links, no rule sets a figure).
 */
export const LINK_LIFETIME_MS: Record<PaymentLinkPurpose, number> = { 'card-details': 24 * 3_600_000, payout: 72 * 3_600_000 };
/** Wrong booking proofs before a link locks (our own choice, in the spirit of OWASP's advice to throttle guessing). */
export const MAX_WRONG_TRIES = 5;
const PAGE_PATH: Record<PaymentLinkPurpose, string> = { 'card-details': 'card', payout: 'payout' };

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

export type LinkState = 'ready' | 'used' | 'expired' | 'locked';

export function linkState(link: PaymentLinkEntity, now: number): LinkState {
  if (link.usedAt) return 'used';
  if (link.wrongTries >= MAX_WRONG_TRIES) return 'locked';
  if (link.expiresAt.getTime() <= now) return 'expired';
  return 'ready';
}

/** Makes a link inside the caller's transaction; the URL (with the only copy of the token) goes into the mail. */
export async function createLink(em: EntityManager, ctx: Pick<PaymentsContext, 'appBaseUrl' | 'now'>, input: { compensationId: number; purpose: PaymentLinkPurpose; attemptKey: string }): Promise<{ url: string; expiresAt: Date }> {
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(ctx.now() + LINK_LIFETIME_MS[input.purpose]);
  await em.insert(PaymentLinkEntity, { ...input, tokenHash: hashToken(token), expiresAt, usedAt: null, wrongTries: 0 });
  return { url: `${ctx.appBaseUrl}/${PAGE_PATH[input.purpose]}/${token}`, expiresAt };
}

export const linkInvalid = () => new DomainError('not_found', 'link_invalid', 'This link does not work. Please check that you opened the whole link from the e-mail.');

const REFUSALS: Record<Exclude<LinkState, 'ready'>, () => DomainError> = {
  used: () => gone('link_used', 'This link has already been used. For your safety it works only once.'),
  expired: () => gone('link_expired', 'This link has expired. For your safety it works only for a short time.'),
  locked: () => locked('link_locked', 'This link is locked after several attempts with booking details that did not match.'),
};

export async function findLink(em: EntityManager, token: string, purpose: PaymentLinkPurpose, lock = false): Promise<PaymentLinkEntity> {
  if (!/^[\w-]{20,100}$/.test(token)) throw linkInvalid();
  const link = await em.findOne(PaymentLinkEntity, { where: { tokenHash: hashToken(token), purpose }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
  if (!link) throw linkInvalid();
  return link;
}

export function refuseUnlessReady(link: PaymentLinkEntity, now: number): void {
  const state = linkState(link, now);
  if (state !== 'ready') throw REFUSALS[state]();
}

/** The same check as the bid page's: the booking reference, and a last name of the passenger compared without case or accents. */
export function proofMatches(row: CompensationRow, proof: BookingProof): boolean {
  const pnrOk = (row.pnr ?? '').toUpperCase() === proof.pnr;
  const nameOk = (row.last_name ?? '').localeCompare(proof.lastName, undefined, { sensitivity: 'base' }) === 0;
  return pnrOk && nameOk;
}

/** Counts a wrong proof; the caller commits it and then refuses, so the count survives the refusal. */
export async function countWrongTry(em: EntityManager, link: PaymentLinkEntity): Promise<number> {
  await em.update(PaymentLinkEntity, { id: link.id }, { wrongTries: link.wrongTries + 1 });
  return Math.max(0, MAX_WRONG_TRIES - link.wrongTries - 1);
}

export function wrongProof(triesLeft: number): DomainError {
  if (triesLeft === 0) return REFUSALS.locked();
  return forbidden(`These booking details do not match this link. ${triesLeft} ${triesLeft === 1 ? 'try' : 'tries'} left.`, 'booking_not_matched');
}

export async function markUsed(em: EntityManager, link: PaymentLinkEntity, now: number): Promise<void> {
  await em.update(PaymentLinkEntity, { id: link.id }, { usedAt: new Date(now) });
}

/** The booking's language for the link's page to open in; the page's switch still lets the passenger pick. */
export function bookingLanguage(stored: string | null): Language | null {
  return isLanguage(stored) ? stored : null;
}
