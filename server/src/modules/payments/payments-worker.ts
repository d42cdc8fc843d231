// Finishes what an interrupted issuance left in 'issuing': a timeout, a 500, a dropped connection, or a server that
// stopped mid-call. It retries with the keys fixed on the row, so the provider answers with what it already did
// instead of issuing again. It claims the rows it takes (db/claim-rows), so a second process's worker, or a route of
// either process, never calls for the same row at once. On start it sweeps every 'issuing' row nobody holds; a
// crashed process's rows are taken up once their lease runs out.
import { KEEP_UPDATED_AT, type Issuer } from './issuer';
import type { PaymentsContext } from './payments-context';

/**
 * Rows the provider has something to do for: cards and transfers (see providerWork), and not a transfer that waits
 * for the passenger to give their account, which only the passenger's page moves on.
 */
const PROVIDER_WORK = `(compensations.medium IN ('prepaid-card', 'bank-transfer') OR compensations.form = 'voucher')
  AND NOT EXISTS (SELECT 1 FROM payouts po WHERE po.attempt_key = compensations.idempotency_key AND po.state = 'awaiting-details')`;

/** Only issuances started under this server's provider account: elsewhere their keys would issue a second card. */
const THIS_ACCOUNT = `EXISTS (SELECT 1 FROM payment_issuances pi WHERE pi.compensation_id = compensations.id AND pi.provider_account = ?)`;

export interface PaymentsWorkerOptions {
  /** Wait between passes when nothing was due. */
  pollMs?: number;
  /** A row tried (or changed) more recently than this waits for a later pass. */
  retryAfterMs?: number;
  /** Issuances in flight at once. */
  concurrency?: number;
  /** Rows taken per pass; a full pass is followed at once by the next. */
  batchSize?: number;
}

export interface PaymentsWorker {
  start(): void;
  /** Stops polling and waits for the attempts in flight. */
  stop(): Promise<void>;
  /** One pass; `all` ignores the retry delay, as the start-up sweep does. Resolves with the rows tried. */
  runOnce(opts?: { all?: boolean }): Promise<number>;
}

export function createPaymentsWorker(ctx: PaymentsContext, issuer: Issuer, opts: PaymentsWorkerOptions = {}): PaymentsWorker {
  const pollMs = opts.pollMs ?? 2_000;
  const retryAfterMs = opts.retryAfterMs ?? 5_000;
  const concurrency = Math.max(1, opts.concurrency ?? 8);
  const batchSize = opts.batchSize ?? 100;
  let stopped = true;
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<number> | null = null;
  /** Set by stop(): a pass takes no further rows, so stopping waits only for the calls already made. */
  let stopRequested = false;

  async function pass(all: boolean): Promise<number> {
    const age = all ? '' : 'AND updated_at <= CURRENT_TIMESTAMP(3) - INTERVAL ? MICROSECOND';
    const { token, rows } = await ctx.claims.compensations.claim<{ id: number }>({
      limit: batchSize,
      leaseMs: ctx.claims.leaseMs,
      due: `state = 'issuing' ${age} AND ${THIS_ACCOUNT} AND ${PROVIDER_WORK}`,
      dueParams: all ? [ctx.providerAccount] : [retryAfterMs * 1000, ctx.providerAccount],
      orderBy: 'updated_at, id',
      alsoSet: KEEP_UPDATED_AT,
    });
    const queue = rows.map((r) => Number(r.id));
    const lane = async () => {
      for (let id = queue.shift(); id !== undefined; id = queue.shift()) {
        if (stopRequested) break;
        await issuer.attemptClaimed(id, token);
      }
    };
    await Promise.all(Array.from({ length: Math.min(concurrency, queue.length) }, lane));
    // Stopping: what was claimed and not tried goes back at once instead of waiting out the lease.
    for (const id of queue) await ctx.claims.compensations.finish(token, id, KEEP_UPDATED_AT);
    return rows.length;
  }

  function schedule(ms: number, all = false): void {
    if (stopped) return;
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => tick(all), ms);
    // Never keeps the process alive by itself; the HTTP server or the test does.
    timer.unref();
  }

  function tick(all: boolean): void {
    timer = null;
    if (stopped || running) return;
    const current = pass(all).catch((error: unknown) => {
      ctx.log(`[payments] worker pass failed: ${(error as Error).message}`);
      return 0;
    });
    running = current;
    void current.then((tried) => {
      running = null;
      // After a sweep, keep sweeping until the backlog is gone; then poll.
      schedule(tried >= batchSize ? 0 : pollMs, all && tried >= batchSize);
    });
  }

  return {
    start() {
      if (!stopped) return;
      stopped = false;
      stopRequested = false;
      schedule(0, true);
    },
    async stop() {
      stopped = true;
      stopRequested = true;
      if (timer) clearTimeout(timer);
      timer = null;
      await running;
      await issuer.idle();
    },
    runOnce(options = {}) {
      return pass(options.all ?? false);
    },
  };
}
