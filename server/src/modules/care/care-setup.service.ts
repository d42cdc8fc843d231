// A station's meal allowances and partner hotels: read by the desk, set by the station's admins, every save audited.
import { randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { CareSetup, CareSetupBody } from '@shared/schemas/care';
import { StationCareSettingsEntity, StationEntity, type StoredPartnerHotel } from '../../db/entities';
import { badRequest, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { audit } from '../audit/audit.service';

/** The station's setup; a station nobody configured has zero allowances and no hotels, and says so. */
export async function careSetupOf(em: EntityManager | DataSource, station: StationEntity): Promise<CareSetup> {
  const row = await em.getRepository(StationCareSettingsEntity).findOneBy({ stationId: station.id });
  return {
    stationId: station.id, currency: station.currency, refreshmentMinor: row?.refreshmentMinor ?? 0, mealMinor: row?.mealMinor ?? 0,
    hotels: row?.hotels ?? [], configured: row !== null,
  };
}

async function stationFor(em: EntityManager | DataSource, user: SessionUser, stationId: number): Promise<StationEntity> {
  const station = canSeeStation(user, stationId) ? await em.getRepository(StationEntity).findOneBy({ id: stationId }) : null;
  if (!station) throw notFound('Station');
  return station;
}

export async function readCareSetup(db: DataSource, user: SessionUser, stationId: number): Promise<CareSetup> {
  return careSetupOf(db, await stationFor(db, user, stationId));
}

const newHotelId = () => `h-${randomBytes(6).toString('hex')}`;

/** Replaces the allowances and the hotel list; a hotel keeps its id while it stays listed, so past records still name it. */
export async function saveCareSetup(db: DataSource, user: SessionUser, stationId: number, body: CareSetupBody): Promise<CareSetup> {
  return db.transaction(async (em) => {
    const station = await stationFor(em, user, stationId);
    const before = await em.findOne(StationCareSettingsEntity, { where: { stationId }, lock: { mode: 'pessimistic_write' } });
    const known = new Set((before?.hotels ?? []).map((h) => h.id));
    const hotels: StoredPartnerHotel[] = body.hotels.map((h, i) => {
      if (h.id !== undefined && !known.has(h.id)) {
        throw badRequest(`hotels.${i}.id: ${h.id} is not one of this station's hotels; leave it out to add a new hotel`, [{ field: `hotels.${i}.id`, rule: 'must be the id of a hotel already on this station’s list, or absent for a new one' }]);
      }
      return { id: h.id ?? newHotelId(), name: h.name, address: h.address, phone: h.phone, nightlyRateMinor: h.nightlyRateMinor };
    });
    const names = hotels.map((h) => h.name.toLowerCase());
    const dup = names.findIndex((n, i) => names.indexOf(n) !== i);
    if (dup >= 0) throw badRequest(`hotels.${dup}.name: ${hotels[dup].name} is listed twice`, [{ field: `hotels.${dup}.name`, rule: 'must be unique in the list' }]);
    await em.save(StationCareSettingsEntity, { stationId, refreshmentMinor: body.refreshmentMinor, mealMinor: body.mealMinor, hotels });
    await audit(em, {
      actor: user, action: 'care_setup.saved', entityType: 'station', entityId: stationId, stationId,
      before: before ? { refreshmentMinor: before.refreshmentMinor, mealMinor: before.mealMinor, hotels: before.hotels } : null,
      after: { currency: station.currency, refreshmentMinor: body.refreshmentMinor, mealMinor: body.mealMinor, hotels },
    });
    return careSetupOf(em, station);
  });
}
