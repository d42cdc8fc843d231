// The flights waiting for a recompute, kept in MariaDB (table forecast_recompute_queue) so that several server
// processes share them. A claim is a lease taken with FOR UPDATE SKIP LOCKED: while it holds, nobody else runs that
// flight; asking again meanwhile raises the row's `requests`, and when the claimer finishes the flight goes back into
// the line, behind the flights that have waited longer (the latest state wins, and a flight with check-ins arriving
// all the time never keeps the others waiting). A process takes the flights it asked for itself (its notices then leave from
// where the change came in); another process's rows only once their lease ran out or nobody claimed them for a
// lease's length (their process died). Its claims count the requests made meanwhile, which the shared claim helper
// (db/claim-rows) does not; the claimer's name is the helper's.
import type { DataSource } from 'typeorm';
import { newClaimerId } from '../../db/claim-rows';

export interface ClaimedRecompute {
  flightId: number;
  /** Only the clock asked: a recompute whose figures did not move writes nothing. */
  onlyIfMoved: boolean;
}

export interface RecomputeQueue {
  /** Asks for a recompute of these flights (flights that no longer exist are passed over). */
  mark(flightIds: readonly number[], onlyIfMoved: boolean): Promise<void>;
  /** Takes up to `limit` waiting flights that nobody is running. */
  claim(limit: number): Promise<ClaimedRecompute[]>;
  /**
   * Done with a claim. The row goes unless someone asked again meanwhile: then it is released, asked as of now, and
   * true is returned (the claimer's next claim finds it once the flights that waited longer are taken).
   */
  finish(claim: ClaimedRecompute): Promise<boolean>;
}

export interface RecomputeQueueOptions {
  /** How long a claim keeps others off a flight; far longer than a recompute takes. */
  leaseMs?: number;
  /** Who claims (tests name two claimers on one database). */
  claimer?: string;
}

export const DEFAULT_RECOMPUTE_LEASE_MS = 30_000;

interface ClaimRow {
  flight_id: number;
  only_if_moved: number | string;
}

export function mariadbRecomputeQueue(db: DataSource, options: RecomputeQueueOptions = {}): RecomputeQueue {
  const leaseMicros = (options.leaseMs ?? DEFAULT_RECOMPUTE_LEASE_MS) * 1000;
  const me = options.claimer ?? newClaimerId();

  return {
    async mark(flightIds, onlyIfMoved) {
      if (flightIds.length === 0) return;
      // From flights, so a flight deleted meanwhile is passed over instead of failing the foreign key for the rest.
      await db.query(
        `INSERT INTO forecast_recompute_queue (flight_id, only_if_moved, requested_by, requested_at)
         SELECT id, ?, ?, UTC_TIMESTAMP(3) FROM flights WHERE id IN (?)
         ON DUPLICATE KEY UPDATE requests = requests + 1, only_if_moved = only_if_moved AND VALUES(only_if_moved), requested_by = VALUES(requested_by)`,
        [onlyIfMoved ? 1 : 0, me, [...new Set(flightIds)]],
      );
    },

    async claim(limit) {
      if (limit <= 0) return [];
      // READ COMMITTED: no gap locks, so a claim never holds up the inserts of mark().
      return db.transaction('READ COMMITTED', async (em) => {
        // A lease that ran out: whatever the dead claimer was asked stays asked, so its flag joins the newer asks'.
        const rows: ClaimRow[] = await em.query(
          `SELECT flight_id, IF(claimed_by IS NULL, only_if_moved, only_if_moved AND claimed_only_if_moved) AS only_if_moved
             FROM forecast_recompute_queue
            WHERE (claimed_by IS NULL AND (requested_by = ? OR requested_at < UTC_TIMESTAMP(3) - INTERVAL ? MICROSECOND))
               OR lease_until < UTC_TIMESTAMP(3)
            ORDER BY requested_at LIMIT ? FOR UPDATE SKIP LOCKED`,
          [me, leaseMicros, limit],
        );
        if (rows.length === 0) return [];
        // Assignments run left to right: the claimed flag is taken before the row's own starts afresh.
        await em.query(
          `UPDATE forecast_recompute_queue
              SET claimed_only_if_moved = IF(claimed_by IS NULL, only_if_moved, only_if_moved AND claimed_only_if_moved),
                  only_if_moved = 1, claimed_by = ?, claimed_requests = requests, lease_until = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND
            WHERE flight_id IN (?)`,
          [me, leaseMicros, rows.map((r) => r.flight_id)],
        );
        return rows.map((r) => ({ flightId: Number(r.flight_id), onlyIfMoved: Number(r.only_if_moved) === 1 }));
      });
    },

    async finish(claim) {
      const done: { affectedRows?: number } = await db.query(
        'DELETE FROM forecast_recompute_queue WHERE flight_id = ? AND claimed_by = ? AND requests = claimed_requests',
        [claim.flightId, me],
      );
      if (done.affectedRows === 1) return false;
      // Asked again while running (or the lease ran out and another claimer took it: then nothing matches below).
      // Released as asked by this process now: it takes the flight again itself, after the flights asked earlier.
      const released: { affectedRows?: number } = await db.query(
        `UPDATE forecast_recompute_queue SET claimed_by = NULL, claimed_requests = NULL, lease_until = NULL,
                requested_by = ?, requested_at = UTC_TIMESTAMP(3) WHERE flight_id = ? AND claimed_by = ?`,
        [me, claim.flightId, me],
      );
      return released.affectedRows === 1;
    },
  };
}
