// Which show-up rates a station's forecasts use: the hand-set profile, the latest learned version, or a pinned one.
import type { DataSource, EntityManager } from 'typeorm';
import type { CommonShock } from '@shared/forecast';
import type { SessionUser } from '@shared/schemas/auth';
import type { RatesChoice } from '@shared/schemas/learning';
import { showUpProfileSchema, type ShowUpProfile } from '@shared/schemas/show-up-profile';
import { LearnedRatesEntity, StationRatesChoiceEntity } from '../../db/entities';
import { badRequest } from '../../domain/errors';
import { audit } from '../audit/audit.service';
import { showUpProfileFor } from '../forecast/profile.service';
import type { RatesModel } from './train';

export interface RatesInUse {
  profile: ShowUpProfile;
  /** The learned version, or null for the hand-set profile. */
  version: number | null;
  /** The learned day-to-day common shock, used when no supervisor has set one on the flight. */
  shock: CommonShock | null;
}

/**
 * A station starts on its hand-set profile: an admin switches it to the learned rates after looking at their
 * calibration, so the odds never change under the agents without someone having chosen it.
 */
export async function ratesChoiceOf(db: DataSource | EntityManager, stationId: number): Promise<RatesChoice> {
  const row = await db.getRepository(StationRatesChoiceEntity).findOneBy({ stationId });
  return row ? { mode: row.mode, pinnedVersion: row.pinnedVersion } : { mode: 'hand-set', pinnedVersion: null };
}

export async function latestVersion(db: DataSource | EntityManager): Promise<number | null> {
  const [row]: { v: number | null }[] = await db.query('SELECT MAX(version) AS v FROM learned_rates');
  return row?.v === null || row?.v === undefined ? null : Number(row.v);
}

/** The version a station's forecasts use now, or null for the hand-set profile. */
export async function versionInUse(db: DataSource | EntityManager, stationId: number): Promise<number | null> {
  const choice = await ratesChoiceOf(db, stationId);
  if (choice.mode === 'hand-set') return null;
  return choice.pinnedVersion ?? (await latestVersion(db));
}

/** The learned profile of one route (or of the station when the route was not learned), from one version. */
export function routeRates(model: RatesModel, stationId: number, destination: string | null): { profile: ShowUpProfile; shockRho: number | null } | null {
  const station = model.stations[String(stationId)];
  if (!station) return null;
  const parsed = showUpProfileSchema.safeParse((destination && station.routes[destination]) ?? station.profile);
  return parsed.success ? { profile: parsed.data, shockRho: station.shockRho } : null;
}

/** The rates a flight's forecast uses, with the version named. Falls back to the hand-set profile when unlearned. */
export async function ratesFor(db: DataSource | EntityManager, stationId: number, destination: string): Promise<RatesInUse> {
  const version = await versionInUse(db, stationId);
  if (version !== null) {
    const row = await db.getRepository(LearnedRatesEntity).findOne({ select: { version: true, model: true }, where: { version } });
    const learned = row ? routeRates(row.model as RatesModel, stationId, destination) : null;
    if (learned) {
      return { profile: learned.profile, version, shock: learned.shockRho ? { kind: 'beta-binomial', rho: learned.shockRho } : null };
    }
  }
  return { profile: await showUpProfileFor(db, stationId), version: null, shock: null };
}

/** An admin's choice for a station, checked against the stored versions, with its audit row. */
export async function putRatesChoice(db: DataSource, stationId: number, choice: RatesChoice, actor: SessionUser): Promise<void> {
  await db.transaction(async (em) => {
    if (choice.pinnedVersion !== null && !(await em.getRepository(LearnedRatesEntity).existsBy({ version: choice.pinnedVersion }))) {
      throw badRequest(`pinnedVersion ${choice.pinnedVersion} does not exist`, [{ field: 'pinnedVersion', rule: 'must be a stored version of the learned rates' }]);
    }
    if (choice.mode === 'learned' && choice.pinnedVersion === null && (await latestVersion(em)) === null) {
      throw badRequest('No learned rates yet: train them first.', [{ field: 'mode', rule: "'learned' needs at least one trained version" }]);
    }
    const before = await ratesChoiceOf(em, stationId);
    await em.upsert(StationRatesChoiceEntity, { stationId, mode: choice.mode, pinnedVersion: choice.pinnedVersion, updatedByUserId: actor.id }, ['stationId']);
    await audit(em, { actor, action: 'rates_choice.updated', entityType: 'station', entityId: stationId, stationId, before, after: choice });
  });
}

/** Stations following the latest learned version: their forecasts move when a new version is saved. */
export async function stationsOnLatestRates(db: DataSource): Promise<number[]> {
  const rows = await db.getRepository(StationRatesChoiceEntity).findBy({ mode: 'learned' });
  return rows.filter((r) => r.pinnedVersion === null).map((r) => r.stationId);
}
