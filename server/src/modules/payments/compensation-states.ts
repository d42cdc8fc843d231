// Where a compensation's payment stands, and which moves are allowed. Webhooks arrive more than once and out of
// order (Stripe docs, "Handle duplicate events" and "Event ordering"), so the provider's news may only move a
// compensation forward: a late 'card created' never undoes 'spent' or 'voided'.
import type { CompensationState } from '../../db/entities/compensation.entity';

/**
 * Forward order for the provider's news. 'failed' sits beside 'issuing'; 'voided' and 'canceled' end an attempt.
 * Only a person's re-issue starts a new attempt from 'failed', 'voided' or 'canceled' (the passenger is still owed).
 */
const RANK: Record<CompensationState, number> = { due: 0, issuing: 1, failed: 1, issued: 2, settled: 3, voided: 4, canceled: 4 };

export function stateRank(state: CompensationState): number {
  return RANK[state];
}

/** A move the provider's news may make: strictly forward, never from voided. */
export function isForward(from: CompensationState, to: CompensationState): boolean {
  return RANK[to] > RANK[from];
}

/** The provider still has to answer for these; a card may exist for them already. */
export const AWAITING_CARD: readonly CompensationState[] = ['due', 'issuing', 'failed'];

// Idempotency keys are derived from the compensation's own id and stored on it before the first call, so every
// retry, by any worker and after any restart, sends the same keys (Stripe docs, "Idempotent requests").
export const baseKeyFor = (compensationId: number) => `comp-${compensationId}`;
export const cardholderKey = (baseKey: string) => `${baseKey}-cardholder`;
export const cardKey = (baseKey: string) => `${baseKey}-card`;
export const voidKey = (compensationId: number) => `comp-${compensationId}-void`;

/** A lost payment attempt: the passenger is owed again and the compensation may be re-issued. */
export const REISSUABLE: readonly CompensationState[] = ['failed', 'voided', 'canceled'];

/**
 * A re-issue after a lost attempt gets fresh keys (comp-<id>-r2, -r3, …): the refused request may have been saved under
 * the old key, and replaying it would only repeat the refusal.
 */
export function reissueKeyFor(compensationId: number, currentKey: string | null): string {
  const match = currentKey ? /-r(\d+)$/.exec(currentKey) : null;
  const next = match ? Number(match[1]) + 1 : 2;
  return `${baseKeyFor(compensationId)}-r${next}`;
}
