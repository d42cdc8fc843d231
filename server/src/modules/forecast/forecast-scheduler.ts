// Coalesces recomputes per flight: at most one runs per flight at a time, and changes that arrive meanwhile are
// taken together by the next one (the latest state wins). When idle a change is recomputed at once; under load the
// batches grow by themselves, because a flight's next recompute starts only when its last one has finished.
import type { DataSource } from 'typeorm';
import { LessThan, MoreThan, Not, In } from 'typeorm';
import { FlightEntity } from '../../db/entities';
import { namedLockLeader, type Leadership } from './clock-leader';
import { liveStoreOf } from './live-store';
import { recomputeFlightDetailed, type RecomputeOutcome, type RecomputeResult } from './forecast.service';

export interface ForecastScheduler {
  markDirty(flightId: number): void;
  /** Waits until every pending recompute has finished (tests, shutdown). */
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
}

export function createForecastScheduler(db: DataSource, onRecomputed: (o: RecomputeOutcome) => void, options: SchedulerOptions = {}): ForecastScheduler {
  const parallel = options.parallel ?? 4;
  const recompute: Recompute = options.recompute ?? ((id, opts) => recomputeFlightDetailed(db, id, opts));
  /** Flights waiting, with whether only the clock asked (then an unmoved flight is skipped). */
  const dirty = new Map<number, { onlyIfMoved: boolean }>();
  const running = new Set<number>();
  let active: Promise<void> | null = null;
  let count = 0;
  let clock: NodeJS.Timeout | null = null;
  let scheduled = false;
  let leader: Leadership | null = null;

  const runOne = async (id: number, onlyIfMoved: boolean) => {
    running.add(id);
    try {
      const r = await recompute(id, { onlyIfMoved });
      count++;
      if (r.status === 'written') onRecomputed(r.outcome);
      // A recompute that read later won the write; this one may have read a change that one missed (the same
      // millisecond): one more pass makes sure nothing committed is left out.
      if (r.status === 'stale' && !dirty.has(id)) dirty.set(id, { onlyIfMoved: false });
    } catch (err) {
      console.error(`[forecast] recompute of flight ${id} failed: ${err instanceof Error ? err.message : err}`);
    } finally {
      running.delete(id);
    }
  };

  // One loop at a time: it starts every waiting flight that is not already running (up to `parallel`), and goes
  // round again as each finishes, so a flight changed during its own recompute is taken again right after it.
  const pump = async () => {
    const inFlight = new Set<Promise<void>>();
    for (;;) {
      for (const [id, why] of dirty) {
        if (inFlight.size >= parallel) break;
        if (running.has(id)) continue;
        dirty.delete(id);
        const p: Promise<void> = runOne(id, why.onlyIfMoved).finally(() => inFlight.delete(p));
        inFlight.add(p);
      }
      if (!inFlight.size) return;
      await Promise.race(inFlight);
    }
  };
  const start = () => {
    scheduled = false;
    if (active) return;
    active = pump().finally(() => {
      active = null;
      if (dirty.size) schedule();
    });
  };
  const schedule = () => {
    if (scheduled || active) return;
    scheduled = true;
    setImmediate(start);
  };

  const mark = (flightId: number, onlyIfMoved: boolean) => {
    const waiting = dirty.get(flightId);
    dirty.set(flightId, { onlyIfMoved: onlyIfMoved && (waiting?.onlyIfMoved ?? true) });
    if (active) return; // the loop in progress picks it up as soon as a slot frees
    schedule();
  };

  const scheduler: ForecastScheduler = {
    markDirty: (flightId) => mark(flightId, false),
    async flush() {
      while (active || dirty.size || scheduled) {
        if (!active) start();
        await active;
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
    },
    stop() {
      if (clock) clearInterval(clock);
      clock = null;
      void leader?.release();
      leader = null;
    },
  };
  return scheduler;
}
