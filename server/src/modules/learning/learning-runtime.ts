// Runs queued training in the background, one at a time in this process, and keeps the nightly clock: each tick
// records the flights that have left and queues a run when none has been asked for since the station day began.
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { ForecastScheduler } from '../forecast/forecast-scheduler';
import { recordDepartedFlights } from './outcomes.service';
import { requestTraining, requeueAbandoned, runQueuedJob } from './jobs.service';

export interface LearningRuntime {
  request(actor: SessionUser | null): ReturnType<typeof requestTraining>;
  /** Starts the queued run, if any, unless this process is already running one. */
  kick(): void;
  /** Resolves when this process has no run in progress (tests, shutdown). */
  idle(): Promise<void>;
  /** One tick of the clock now. */
  tick(now?: Date): Promise<void>;
  start(intervalMs?: number): Promise<void>;
  stop(): void;
}

/** The nightly run is due once the UTC day has turned since the last run was asked for (our own simple rule). */
async function nightlyDue(db: DataSource, now: Date): Promise<boolean> {
  const [row]: { at: Date | null }[] = await db.query('SELECT MAX(requested_at) AS at FROM learning_jobs');
  if (!row?.at) return true;
  return new Date(row.at).toISOString().slice(0, 10) < now.toISOString().slice(0, 10);
}

export function createLearningRuntime(db: DataSource, opts: { forecast?: ForecastScheduler; onNewVersion?: (version: number) => void } = {}): LearningRuntime {
  let running: Promise<void> | null = null;
  let clock: NodeJS.Timeout | null = null;

  const kick = () => {
    if (running) return;
    running = (async () => {
      for (;;) {
        const version = await runQueuedJob(db);
        if (version === null) {
          const [queued] = await db.query("SELECT id FROM learning_jobs WHERE status = 'queued' LIMIT 1");
          if (!queued) return;
          continue;
        }
        opts.onNewVersion?.(version);
      }
    })()
      .catch((err: unknown) => console.error(`[learning] ${err instanceof Error ? err.message : String(err)}`))
      .finally(() => {
        running = null;
      });
  };

  const runtime: LearningRuntime = {
    async request(actor) {
      const answer = await requestTraining(db, 'on-demand', actor);
      kick();
      return answer;
    },
    kick,
    async idle() {
      while (running) await running;
    },
    async tick(now = new Date()) {
      // The forecast clock moves flight states along (to departed); calling it is how this clock keeps step with it.
      if (opts.forecast) await opts.forecast.tick();
      await recordDepartedFlights(db, now);
      if (await nightlyDue(db, now)) await requestTraining(db, 'nightly', null);
      kick();
    },
    async start(intervalMs = 10 * 60_000) {
      await requeueAbandoned(db);
      kick();
      clock = setInterval(() => void runtime.tick().catch((err: unknown) => console.error(`[learning] tick failed: ${String(err)}`)), intervalMs);
      clock.unref();
    },
    stop() {
      if (clock) clearInterval(clock);
    },
  };
  return runtime;
}
