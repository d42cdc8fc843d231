// The worker's SQL, on the claim helper every worker uses (db/claim-rows): a worker claims due rows for a lease,
// counting the attempt, then sends without a lock. Every later write is fenced on the claim's token, so a worker
// whose lease ran out can never record over a newer claim.
import type { DataSource } from 'typeorm';
import { rowClaimer, type RowClaimer } from '../../db/claim-rows';

export interface ClaimedMessage {
  id: string;
  /** The claim's token: the fence for the writes below. */
  token: string;
  /** attempts after this claim: 1 on the first send. */
  attempt: number;
  to: string;
  subject: string;
  text: string;
  html: string | null;
}

export interface ClaimOptions {
  limit: number;
  leaseMs: number;
  /** Only these flights' messages (a test sharing the database with other workers); all when absent. */
  onlyFlightIds?: readonly number[];
}

interface ClaimRow extends Record<string, unknown> {
  id: string;
  attempts: number;
  to_address: string;
  subject: string;
  text: string;
  html: string | null;
}

const LAST_ERROR_MAX = 500;
const OUTBOX = { table: 'outbox_messages', key: 'id' };

/** One claimer per database per process: its tokens name this process. */
const claimers = new WeakMap<DataSource, RowClaimer>();
function claimerFor(db: DataSource): RowClaimer {
  let claimer = claimers.get(db);
  if (!claimer) claimers.set(db, (claimer = rowClaimer(db, OUTBOX)));
  return claimer;
}

export async function claimDueMessages(db: DataSource, opts: ClaimOptions): Promise<ClaimedMessage[]> {
  if (opts.onlyFlightIds?.length === 0) return [];
  const scope = opts.onlyFlightIds ? 'AND flight_id IN (?)' : '';
  const claim = await claimerFor(db).claim<ClaimRow>({
    limit: opts.limit,
    leaseMs: opts.leaseMs,
    due: `status = 'pending' AND next_attempt_at <= UTC_TIMESTAMP(3) ${scope}`,
    dueParams: opts.onlyFlightIds ? [opts.onlyFlightIds] : [],
    orderBy: 'next_attempt_at',
    columns: 'id, attempts, to_address, subject, text, html',
    alsoSet: 'attempts = attempts + 1',
  });
  return claim.rows.map((r) => ({ id: r.id, token: claim.token, attempt: r.attempts + 1, to: r.to_address, subject: r.subject, text: r.text, html: r.html }));
}

function fencedUpdate(db: DataSource, claim: ClaimedMessage, set: string, params: unknown[]): Promise<boolean> {
  return claimerFor(db).finish(claim.token, claim.id, set, params);
}

/** After the server's 250: the only way a row becomes 'sent'. */
export function markSent(db: DataSource, claim: ClaimedMessage): Promise<boolean> {
  return fencedUpdate(db, claim, `status = 'sent', sent_at = UTC_TIMESTAMP(3)`, []);
}

export function markRetry(db: DataSource, claim: ClaimedMessage, delayMs: number, reason: string): Promise<boolean> {
  return fencedUpdate(db, claim, 'next_attempt_at = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND, last_error = ?', [delayMs * 1000, clip(reason)]);
}

export function markFailed(db: DataSource, claim: ClaimedMessage, reason: string): Promise<boolean> {
  return fencedUpdate(db, claim, `status = 'failed', last_error = ?`, [clip(reason)]);
}

/** Hands back a claim that was never tried (the worker is stopping), as if it had not been taken. */
export function releaseClaim(db: DataSource, claim: ClaimedMessage): Promise<boolean> {
  return fencedUpdate(db, claim, 'attempts = attempts - 1', []);
}

function clip(reason: string): string {
  return reason.length <= LAST_ERROR_MAX ? reason : `${reason.slice(0, LAST_ERROR_MAX - 1)}…`;
}
