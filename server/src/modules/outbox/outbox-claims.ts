// The worker's SQL. A claim is a lease: in one short transaction a worker locks due rows (skipping rows another
// worker holds), bumps attempts and pushes next_attempt_at past the lease, then commits and sends without a
// lock. Every later write is fenced on (status 'pending', the attempts value of the claim), so a worker whose
// lease ran out can never record over a newer claim.
import type { DataSource } from 'typeorm';

export interface ClaimedMessage {
  id: string;
  /** attempts after this claim: 1 on the first send. Also the fence for the writes below. */
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

interface ClaimRow {
  id: string;
  attempts: number;
  to_address: string;
  subject: string;
  text: string;
  html: string | null;
}

const LAST_ERROR_MAX = 500;

export async function claimDueMessages(db: DataSource, opts: ClaimOptions): Promise<ClaimedMessage[]> {
  if (opts.onlyFlightIds?.length === 0) return [];
  const scope = opts.onlyFlightIds ? 'AND flight_id IN (?)' : '';
  const params: unknown[] = opts.onlyFlightIds ? [opts.onlyFlightIds, opts.limit] : [opts.limit];
  // READ COMMITTED: no gap locks, so a claim never holds up the inserts of enqueueMessage.
  return db.transaction('READ COMMITTED', async (em) => {
    // SKIP LOCKED (MariaDB 10.6+): rows another worker is claiming right now are passed over, not waited for.
    const rows: ClaimRow[] = await em.query(
      `SELECT id, attempts, to_address, subject, text, html FROM outbox_messages
        WHERE status = 'pending' AND next_attempt_at <= UTC_TIMESTAMP(3) ${scope}
        ORDER BY next_attempt_at LIMIT ? FOR UPDATE SKIP LOCKED`,
      params,
    );
    if (rows.length === 0) return [];
    await em.query(
      `UPDATE outbox_messages SET attempts = attempts + 1, next_attempt_at = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND WHERE id IN (?)`,
      [opts.leaseMs * 1000, rows.map((r) => r.id)],
    );
    return rows.map((r) => ({ id: r.id, attempt: r.attempts + 1, to: r.to_address, subject: r.subject, text: r.text, html: r.html }));
  });
}

async function fencedUpdate(db: DataSource, claim: ClaimedMessage, set: string, params: unknown[]): Promise<boolean> {
  const result: { affectedRows?: number } = await db.query(
    `UPDATE outbox_messages SET ${set} WHERE id = ? AND status = 'pending' AND attempts = ?`,
    [...params, claim.id, claim.attempt],
  );
  return result.affectedRows === 1;
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
  return fencedUpdate(db, claim, 'attempts = attempts - 1, next_attempt_at = UTC_TIMESTAMP(3)', []);
}

function clip(reason: string): string {
  return reason.length <= LAST_ERROR_MAX ? reason : `${reason.slice(0, LAST_ERROR_MAX - 1)}…`;
}
