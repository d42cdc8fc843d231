import { Between, In, Not, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { DEFAULT_SHOW_UP_PROFILE, showUpProfileSchema, type ShowUpProfile } from '@shared/schemas/show-up-profile';
import { FlightEntity, ShowUpProfileEntity } from '../../db/entities';
import { forecastStale, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';

export interface StationShowUpProfile {
  stationId: number;
  profile: ShowUpProfile;
  /** True until an admin saves one: the forecast runs on the default figures. */
  isDefault: boolean;
  updatedAt: string | null;
  updatedByUserId: number | null;
}

function present(stationId: number, row: ShowUpProfileEntity | null): StationShowUpProfile {
  // A stored profile that no longer passes the schema is treated as absent, as the forecast does.
  const parsed = row ? showUpProfileSchema.safeParse(row.profile) : null;
  if (!row || !parsed?.success) return { stationId, profile: DEFAULT_SHOW_UP_PROFILE, isDefault: true, updatedAt: null, updatedByUserId: null };
  return { stationId, profile: parsed.data, isDefault: false, updatedAt: row.updatedAt.toISOString(), updatedByUserId: row.updatedByUserId };
}

export async function getShowUpProfile(db: DataSource, stationId: number): Promise<StationShowUpProfile> {
  return present(stationId, await db.getRepository(ShowUpProfileEntity).findOneBy({ stationId }));
}

export async function putShowUpProfile(db: DataSource, stationId: number, profile: ShowUpProfile, actor: SessionUser): Promise<StationShowUpProfile> {
  return db.transaction(async (em) => {
    const existing = await em.findOne(ShowUpProfileEntity, { where: { stationId }, lock: { mode: 'pessimistic_write' } });
    const before = present(stationId, existing);
    await em.upsert(ShowUpProfileEntity, { stationId, profile, updatedByUserId: actor.id }, ['stationId']);
    const after = present(stationId, await em.findOneByOrFail(ShowUpProfileEntity, { stationId }));
    await audit(em, { actor, action: 'show_up_profile.updated', entityType: 'show_up_profile', entityId: stationId, stationId, before: before.isDefault ? { default: true, profile: before.profile } : before.profile, after: after.profile });
    // The odds of flights already on the boards move with the profile; the answer does not wait for them.
    recordEffect(em, ...(await openFlightIds(em, stationId)).map(forecastStale));
    return after;
  });
}

/** The station's flights still to leave in the next 24 hours: the ones whose odds a new profile moves. */
export async function openFlightIds(db: DataSource | EntityManager, stationId: number, now = new Date()): Promise<number[]> {
  const flights = await db.getRepository(FlightEntity).find({
    select: { id: true },
    where: { stationId, scheduledDeparture: Between(new Date(now.getTime() - 15 * 60_000), new Date(now.getTime() + 24 * 3_600_000)), state: Not(In(['departed', 'cancelled'])) },
  });
  return flights.map((f) => f.id);
}
