// Coalesces bursts: a batch of 200 check-ins marks a flight dirty 200 times and recomputes it once. A recompute
// starts at most `delayMs` after the first change, so figures are never stale for longer than that plus the work.
import type { DataSource } from 'typeorm';
import { MoreThan, Not, In } from 'typeorm';
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

export function createForecastScheduler(db: DataSource, onRecomputed: (o: RecomputeOutcome) => void, delayMs = 150): ForecastScheduler {
  const dirty = new Set<number>();
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<void> = Promise.resolve();
  let count = 0;
  let clock: NodeJS.Timeout | null = null;

  const runPending = () => {
    timer = null;
    const ids = [...dirty];
    dirty.clear();
    running = running.then(async () => {
      for (const id of ids) {
        try {
          const outcome = await recomputeFlight(db, id);
          count++;
          if (outcome) onRecomputed(outcome);
        } catch (err) {
          console.error(`[forecast] recompute of flight ${id} failed: ${err instanceof Error ? err.message : err}`);
        }
      }
    });
  };

  const scheduler: ForecastScheduler = {
    markDirty(flightId) {
      dirty.add(flightId);
      timer ??= setTimeout(runPending, delayMs);
    },
    async flush() {
      if (timer) {
        clearTimeout(timer);
        runPending();
      }
      await running;
    },
    recomputeCount: () => count,
    // Without events the figures still move: people not yet checked in become less likely to show as time passes.
    startClock(intervalMs = 60_000) {
      const tick = async () => {
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
