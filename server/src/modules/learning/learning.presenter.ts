// What the calibration screen reads for one station.
import type { DataSource } from 'typeorm';
import type { Calibration, StationLearning } from '@shared/schemas/learning';
import { LearnedRatesEntity } from '../../db/entities';
import { latestJob } from './jobs.service';
import { ratesChoiceOf, versionInUse } from './rates.service';
import type { RatesModel } from './train';

export async function stationLearning(db: DataSource, stationId: number): Promise<StationLearning> {
  const [choice, inUse, job, versions] = await Promise.all([
    ratesChoiceOf(db, stationId),
    versionInUse(db, stationId),
    latestJob(db),
    db.getRepository(LearnedRatesEntity).find({ select: { version: true, createdAt: true, flightsTrained: true, flightsHeldOut: true }, order: { version: 'DESC' }, take: 20 }),
  ]);
  const shown = inUse ?? versions[0]?.version ?? null;
  const row = shown === null ? null : await db.getRepository(LearnedRatesEntity).findOneBy({ version: shown });
  const calibration = ((row?.calibration ?? []) as Calibration[]).filter((c) => c.stationId === stationId);
  const latest = versions[0];
  return {
    stationId, choice, inUse, job,
    latest: latest ? { version: latest.version, createdAt: latest.createdAt.toISOString(), flightsTrained: latest.flightsTrained, flightsHeldOut: latest.flightsHeldOut } : null,
    versions: versions.map((v) => v.version),
    calibration,
    shockRho: row ? ((row.model as RatesModel).stations[String(stationId)]?.shockRho ?? null) : null,
    // Versions learned before segments were kept have none.
    segments: row ? ((row.model as RatesModel).stations[String(stationId)]?.segments ?? []) : [],
  };
}
