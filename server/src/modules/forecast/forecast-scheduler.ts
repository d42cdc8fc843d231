// Coalesces bursts: a batch of 200 check-ins marks a flight dirty 200 times and recomputes it once. A recompute
// starts at most `delayMs` after the first change, so figures are never stale for longer than that plus the work.
import type { DataSource } from 'typeorm';
import { LessThan, MoreThan, Not, In } from 'typeorm';
import { FlightEntity } from '../../db/entities';
import { recomputeFlight, type RecomputeOutcome } from './forecast.service';

export interface ForecastScheduler {
  markDirty(flightId: number): void;
  /** Waits until every pending recompute has finished (tests, shutdown). */
  flush(): Promise<void>;
  recomputeCount(): number;
  startClock(intervalMs?: number): void;
  stop(): void;
}

/**
 * Moves flight states along the clock until the departure-control feed sends states of its own: boarding from
 * 40 minutes before departure, departed 10 minutes after it (common practice for narrow-body turns, no source).
 */
async function advanceFlightStates(db: DataSource, now: Date) {
  const repo = db.getRepository(FlightEntity);
  await repo.update({ state: In(['scheduled', 'check-in-open']), scheduledDeparture: LessThan(new Date(now.getTime() + 40 * 60_000)) }, { state: 'boarding' });
  await repo.update({ state: In(['scheduled', 'check-in-open', 'boarding', 'closed']), scheduledDeparture: LessThan(new Date(now.getTime() - 10 * 60_000)) }, { state: 'departed' });
}

export function createForecastScheduler(db: DataSource, onRecomputed: (o: RecomputeOutcome) => void, delayMs = 150, parallel = 4): ForecastScheduler {
  const dirty = new Set<number>();
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<void> | null = null;
  let count = 0;
  let clock: NodeJS.Timeout | null = null;

  const recompute = async (id: number) => {
    try {
      const outcome = await recomputeFlight(db, id);
      count++;
      if (outcome) onRecomputed(outcome);
    } catch (err) {
      console.error(`[forecast] recompute of flight ${id} failed: ${err instanceof Error ? err.message : err}`);
    }
  };

  // One drain loop at a time: it takes every flight dirty *now*, recomputes them (a few in parallel), and goes round
  // again while new changes arrived meanwhile. Under load the batches grow instead of queueing behind each other.
  const drain = async () => {
    while (dirty.size) {
      const ids = [...dirty];
      dirty.clear();
      for (let i = 0; i < ids.length; i += parallel) await Promise.all(ids.slice(i, i + parallel).map(recompute));
    }
  };
  const runPending = () => {
    timer = null;
    if (running) return; // the loop in progress will pick the new changes up
    running = drain().finally(() => {
      running = null;
      // A change that slipped in as the loop was finishing still gets its recompute.
      if (dirty.size) timer ??= setTimeout(runPending, delayMs);
    });
  };

  const scheduler: ForecastScheduler = {
    markDirty(flightId) {
      dirty.add(flightId);
      if (!running) timer ??= setTimeout(runPending, delayMs);
    },
    async flush() {
      if (timer) {
        clearTimeout(timer);
        runPending();
      }
      while (running || dirty.size) {
        if (!running) runPending();
        await running;
      }
    },
    recomputeCount: () => count,
    // Without events the figures still move: people not yet checked in become less likely to show as time passes.
    startClock(intervalMs = 60_000) {
      const tick = async () => {
        await advanceFlightStates(db, new Date());
        const open = await db.getRepository(FlightEntity).find({
          select: { id: true },
          where: { scheduledDeparture: MoreThan(new Date(Date.now() - 15 * 60_000)), state: Not(In(['departed', 'cancelled'])) },
        });
        for (const f of open) scheduler.markDirty(f.id);
      };
      void tick().catch(() => undefined);
      clock = setInterval(() => void tick().catch(() => undefined), intervalMs);
      clock.unref();
    },
    stop() {
      if (clock) clearInterval(clock);
      if (timer) clearTimeout(timer);
    },
  };
  return scheduler;
}
