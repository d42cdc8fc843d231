// Training runs: durable rows, one queued or running at a time (a request meanwhile joins it), run in the background.
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { LearningJob } from '@shared/schemas/learning';
import { LearnedRatesEntity, LearningJobEntity, StationEntity } from '../../db/entities';
import { audit } from '../audit/audit.service';
import { showUpProfileFor } from '../forecast/profile.service';
import { evaluateModel } from './evaluate';
import { recordDepartedFlights } from './outcomes.service';
import { readTrainingFlights } from './history.repository';
import { learnModel, splitHeldOut } from './train';
import { driverErrorCode } from '../../db/driver-errors';


export function presentJob(j: LearningJobEntity): LearningJob {
  return {
    id: j.id, status: j.status, trigger: j.trigger, progress: j.progress, stage: j.stage, error: j.error, ratesVersion: j.ratesVersion,
    requestedAt: j.requestedAt.toISOString(), finishedAt: j.finishedAt?.toISOString() ?? null, requests: j.requests,
  };
}

/**
 * Queues a training run, or joins the one already queued or running: the unique index on the generated `active`
 * column admits one such row, so two requests at once (from any number of processes) end in one run.
 */
export async function requestTraining(db: DataSource, trigger: 'on-demand' | 'nightly', actor: SessionUser | null): Promise<{ job: LearningJob; joined: boolean }> {
  for (let attempt = 1; ; attempt++) {
    try {
      const job = await db.transaction(async (em) => {
        const { identifiers } = await em.insert(LearningJobEntity, { status: 'queued', trigger, requestedByUserId: actor?.id ?? null, progress: 0, stage: 'waiting to start' });
        const id = Number(identifiers[0].id);
        await audit(em, { actor: actor ?? { label: 'learning clock' }, action: 'learning_job.requested', entityType: 'learning_job', entityId: id, after: { trigger } });
        return em.findOneByOrFail(LearningJobEntity, { id });
      });
      return { job: presentJob(job), joined: false };
    } catch (err) {
      // A duplicate means a run is already queued or running; a deadlock, two requests racing for that one slot.
      if (!['ER_DUP_ENTRY', 'ER_LOCK_DEADLOCK'].includes(String(driverErrorCode(err))) || attempt >= 5) throw err;
    }
    // A run that has shown no sign of life for 15 minutes was left by a process that stopped: it starts again.
    await db.query("UPDATE learning_jobs SET status = 'queued', stage = 'waiting to start again' WHERE status = 'running' AND started_at < UTC_TIMESTAMP(3) - INTERVAL 15 MINUTE");
    await db.query('UPDATE learning_jobs SET requests = requests + 1 WHERE active = 1');
    const [active] = await db.getRepository(LearningJobEntity).query('SELECT id FROM learning_jobs WHERE active = 1');
    if (active) return { job: presentJob(await db.getRepository(LearningJobEntity).findOneByOrFail({ id: Number(active.id) })), joined: true };
    // It finished between the insert and the look: try to queue a new one.
  }
}

export async function latestJob(db: DataSource): Promise<LearningJob | null> {
  const [row] = await db.getRepository(LearningJobEntity).find({ order: { id: 'DESC' }, take: 1 });
  return row ? presentJob(row) : null;
}

export async function jobById(db: DataSource, id: number): Promise<LearningJob | null> {
  const row = await db.getRepository(LearningJobEntity).findOneBy({ id });
  return row ? presentJob(row) : null;
}

async function progress(db: DataSource, id: number, percent: number, stage: string) {
  await db.getRepository(LearningJobEntity).update({ id }, { progress: percent, stage });
}

/** Claims the queued run (an atomic UPDATE: one process wins) and runs it; returns the new version, if any. */
export async function runQueuedJob(db: DataSource): Promise<number | null> {
  const claimed: { affectedRows?: number } = await db.query("UPDATE learning_jobs SET status = 'running', started_at = UTC_TIMESTAMP(3), stage = 'starting' WHERE status = 'queued' ORDER BY id LIMIT 1");
  if (!claimed.affectedRows) return null;
  const [{ id }] = await db.query("SELECT id FROM learning_jobs WHERE status = 'running' ORDER BY id DESC LIMIT 1");
  const jobId = Number(id);
  try {
    await progress(db, jobId, 5, 'recording departed flights');
    await recordDepartedFlights(db);
    await progress(db, jobId, 20, 'reading closed flights');
    const flights = await readTrainingFlights(db);
    const stations = await db.getRepository(StationEntity).find({ select: { id: true } });
    const handSet = new Map(await Promise.all(stations.map(async (s) => [s.id, await showUpProfileFor(db, s.id)] as const)));
    const handSetOf = (stationId: number) => handSet.get(stationId)!;
    await progress(db, jobId, 40, `learning from ${flights.length} flights`);
    const { training, heldOut } = splitHeldOut(flights);
    const model = learnModel(training, handSetOf);
    await progress(db, jobId, 60, `scoring ${heldOut.length} held-out flights`);
    const calibration = evaluateModel(heldOut, model, handSetOf);
    await progress(db, jobId, 90, 'saving');
    return await db.transaction(async (em) => {
      const { identifiers } = await em.insert(LearnedRatesEntity, { jobId, flightsTrained: training.length, flightsHeldOut: heldOut.length, model, calibration });
      const version = Number(identifiers[0].version);
      await em.update(LearningJobEntity, { id: jobId }, { status: 'done', progress: 100, stage: `version ${version} saved`, ratesVersion: version, finishedAt: new Date() });
      await audit(em, { actor: { label: 'learning job' }, action: 'learned_rates.created', entityType: 'learned_rates', entityId: version, after: { jobId, flightsTrained: training.length, flightsHeldOut: heldOut.length } });
      return version;
    });
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    await db.getRepository(LearningJobEntity).update({ id: jobId }, { status: 'failed', stage: 'failed', error: message.slice(0, 500), finishedAt: new Date() });
    console.error(`[learning] job ${jobId} failed: ${message}`);
    return null;
  }
}

/** A run left 'running' by a process that stopped goes back to the queue (called once at start-up). */
export async function requeueAbandoned(db: DataSource): Promise<void> {
  await db.query("UPDATE learning_jobs SET status = 'queued', stage = 'waiting to start again' WHERE status = 'running'");
}
