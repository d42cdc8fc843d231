// Coalesces recomputes per flight: at most one runs per flight at a time, and changes that arrive meanwhile are
// taken together by the next one (the latest state wins). When idle a change is recomputed at once; under load the
// batches grow by themselves, because a flight's next recompute starts only when its last one has finished.
// The flights waiting live in a MariaDB queue (recompute-queue.ts), so several processes share them and the flights a
// dead process had claimed are taken again by the others once its lease runs out.
import type { DataSource } from 'typeorm';
import { LessThan, MoreThan, Not, In } from 'typeorm';
import { FlightEntity } from '../../db/entities';
import { namedLockLeader, type Leadership } from './clock-leader';
import { liveStoreOf } from './live-store';
import { recomputeFlightDetailed, type RecomputeOutcome, type RecomputeResult } from './forecast.service';
import { mariadbRecomputeQueue, type ClaimedRecompute, type RecomputeQueue } from './recompute-queue';

export interface ForecastScheduler {
  markDirty(flightId: number): void;
  /** Waits until every recompute this process asked for has finished (tests, shutdown). */
  flush(): Promise<void>;
  recomputeCount(): number;
  startClock(intervalMs?: number): void;
  /** One tick of the clock now: flight states moved along, every open flight recomputed if its figures moved. */
  tick(): Promise<void>;
  stop(): void;
}

export type Recompute = (flightId: number, opts: { onlyIfMoved: boolean }) => Promise<RecomputeResult>;

/**
 * Moves flight states along the clock until the departure-control feed sends states of its own: boarding from
 * 40 minutes before departure, departed 10 minutes after it (common practice for narrow-body turns, no source).
 */
async function advanceFlightStates(db: DataSource, now: Date) {
  const repo = db.getRepository(FlightEntity);
  await repo.update({ state: In(['scheduled', 'check-in-open']), scheduledDeparture: LessThan(new Date(now.getTime() + 40 * 60_000)) }, { state: 'boarding' });
  await repo.update({ state: In(['scheduled', 'check-in-open', 'boarding', 'closed']), scheduledDeparture: LessThan(new Date(now.getTime() - 10 * 60_000)) }, { state: 'departed' });
}

export interface SchedulerOptions {
  /** Recomputes running at once across flights. */
  parallel?: number;
  /** The recompute itself; tests pass their own. */
  recompute?: Recompute;
  /** Who ticks the clock when several processes share the database (default: a named lock in MariaDB). */
  leader?: Leadership;
  /** Where the flights waiting are kept (default: MariaDB, shared by every process on the database). */
  queue?: RecomputeQueue;
  /** How long a claim keeps other processes off a flight (default 30 s). */
  leaseMs?: number;
  /** How often a started scheduler looks for flights a dead process left (default 5 s). */
  sweepMs?: number;
}

export function createForecastScheduler(db: DataSource, onRecomputed: (o: RecomputeOutcome) => void, options: SchedulerOptions = {}): ForecastScheduler {
  const parallel = options.parallel ?? 4;
  const recompute: Recompute = options.recompute ?? ((id, opts) => recomputeFlightDetailed(db, id, opts));
  const queue = options.queue ?? mariadbRecomputeQueue(db, { leaseMs: options.leaseMs });
  const log = (line: string, err: unknown) => console.error(`[forecast] ${line}: ${err instanceof Error ? err.message : String(err)}`);
  /** Asks not yet in the queue, with whether only the clock asked: a burst in one turn of the loop is one statement. */
  const asks = new Map<number, boolean>();
  let asksScheduled = false;
  let writes: Promise<boolean> = Promise.resolve(true);
  /** Writes of asks started and not yet settled: flush() waits for them too. */
  let writing = 0;
  /** Something may be waiting in the queue that the loop has not looked for yet. */
  let wanted = false;
  let active: Promise<void> | null = null;
  let wake: (() => void) | null = null;
  let count = 0;
  let clock: NodeJS.Timeout | null = null;
  let sweep: NodeJS.Timeout | null = null;
  let scheduled = false;
  let leader: Leadership | null = null;

  const writeAsks = async (): Promise<boolean> => {
    const batch = [...asks];
    asks.clear();
    if (batch.length === 0) return true;
    const full = batch.filter(([, onlyIfMoved]) => !onlyIfMoved).map(([id]) => id);
    const clockOnly = batch.filter(([, onlyIfMoved]) => onlyIfMoved).map(([id]) => id);
    try {
      if (full.length) await queue.mark(full, false);
      if (clockOnly.length) await queue.mark(clockOnly, true);
    } catch (err) {
      // Kept, and written again by the next ask or sweep.
      for (const [id, onlyIfMoved] of batch) asks.set(id, (asks.get(id) ?? true) && onlyIfMoved);
      log('could not queue recomputes', err);
      return false;
    }
    wanted = true;
    schedule();
    return true;
  };
  const queueAsks = () => {
    asksScheduled = false;
    writing += 1;
    writes = writes.then(writeAsks).finally(() => void (writing -= 1));
    return writes;
  };

  const runOne = async (c: ClaimedRecompute) => {
    try {
      const r = await recompute(c.flightId, { onlyIfMoved: c.onlyIfMoved });
      count++;
      if (r.status === 'written') onRecomputed(r.outcome);
      // A recompute that read later won the write; this one may have read a change that one missed (the same
      // millisecond): one more pass makes sure nothing committed is left out.
      if (r.status === 'stale') await queue.mark([c.flightId], false);
    } catch (err) {
      log(`recompute of flight ${c.flightId} failed`, err);
    }
    try {
      if (await queue.finish(c)) wanted = true;
    } catch (err) {
      // The claim stays until its lease runs out; then the flight is taken again.
      log(`could not finish the recompute of flight ${c.flightId}`, err);
    }
  };

  // One loop at a time: it claims waiting flights up to `parallel` and goes round again as each finishes or as new
  // asks are queued. A flight asked for again while it runs goes back into the line when it finishes (see finish()).
  // A claim that found fewer flights than it had room for emptied the line: the next claim waits for a sign of new
  // work (an ask written, a flight put back, the sweep) instead of costing a transaction each time a slot frees.
  const pump = async () => {
    const inFlight = new Set<Promise<void>>();
    let drained = false;
    for (;;) {
      const signalled = wanted;
      wanted = false;
      let claims: ClaimedRecompute[] = [];
      if (inFlight.size < parallel && (signalled || !drained)) {
        const room = parallel - inFlight.size;
        try {
          claims = await queue.claim(room);
          drained = claims.length < room;
        } catch (err) {
          drained = false;
          log('could not claim recomputes', err);
        }
      }
      for (const c of claims) {
        const p: Promise<void> = runOne(c).finally(() => inFlight.delete(p));
        inFlight.add(p);
      }
      if (inFlight.size === 0) {
        if (wanted) continue;
        return;
      }
      await Promise.race([...inFlight, new Promise<void>((resolve) => (wake = resolve))]);
      wake = null;
    }
  };
  const start = () => {
    scheduled = false;
    if (active) return;
    active = pump().finally(() => {
      active = null;
      if (wanted) schedule();
    });
  };
  function schedule() {
    if (active) {
      wake?.();
      return;
    }
    if (scheduled) return;
    scheduled = true;
    setImmediate(start);
  }

  const mark = (flightId: number, onlyIfMoved: boolean) => {
    asks.set(flightId, (asks.get(flightId) ?? true) && onlyIfMoved);
    if (asksScheduled) return;
    asksScheduled = true;
    setImmediate(() => void queueAsks());
  };

  const scheduler: ForecastScheduler = {
    markDirty: (flightId) => mark(flightId, false),
    async flush() {
      for (;;) {
        if (asks.size > 0 || asksScheduled) {
          if (!(await queueAsks())) return;
        } else if (writing > 0) {
          if (!(await writes)) return;
        } else if (active) await active;
        else if (scheduled || wanted) start();
        else return;
      }
    },
    recomputeCount: () => count,
    async tick() {
      await advanceFlightStates(db, new Date());
      const open = await db.getRepository(FlightEntity).find({
        select: { id: true },
        where: { scheduledDeparture: MoreThan(new Date(Date.now() - 15 * 60_000)), state: Not(In(['departed', 'cancelled'])) },
      });
      for (const f of open) mark(f.id, true);
      liveStoreOf(db).keepOnly(new Set(open.map((f) => f.id)));
    },
    // Without events the figures still move: people not yet checked in become less likely to show as time passes.
    // Only the leader ticks: every process would otherwise recompute every open flight each minute.
    startClock(intervalMs = 60_000) {
      leader = options.leader ?? namedLockLeader(db);
      const held = leader;
      const beat = () => void held.isLeader().then((lead) => (lead ? scheduler.tick() : undefined)).catch(() => undefined);
      beat();
      clock = setInterval(beat, intervalMs);
      clock.unref();
      // Flights a dead process had claimed or asked for, and asks this one could not write.
      sweep = setInterval(() => {
        if (asks.size > 0 && !asksScheduled) void queueAsks();
        wanted = true;
        schedule();
      }, options.sweepMs ?? 5_000);
      sweep.unref();
    },
    stop() {
      if (clock) clearInterval(clock);
      if (sweep) clearInterval(sweep);
      clock = null;
      sweep = null;
      void leader?.release();
      leader = null;
    },
  };
  return scheduler;
}
