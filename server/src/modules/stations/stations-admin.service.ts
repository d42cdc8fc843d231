// Stations as an admin keeps them. Any admin edits the stations they hold; only a carrier-wide admin opens a new one
// (it then holds it, so it can set it up), since a station admin's reach is the stations already granted.
import { In, type DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { StationCreateBody, StationSettings, StationUpdateBody } from '@shared/schemas/admin-stations';
import { StationEntity, UserEntity } from '../../db/entities';
import { badRequest, conflict, forbidden, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { findAirport } from '../../reference/airports';
import { audit } from '../audit/audit.service';

export function presentSettings(s: StationEntity): StationSettings {
  return {
    id: s.id, iata: s.iata, name: s.name, timeZone: s.timeZone, regime: s.regime, currency: s.currency,
    // Basis points to percent: 500 bp = 5 %, 15000 bp = 150 %.
    riskTolerancePercent: s.riskToleranceBp / 100, departureGraceMinutes: s.departureGraceMinutes, maxOverbookingPercent: s.maxOverbookingBp / 100,
  };
}

async function viewerIsCarrierWide(db: DataSource, user: SessionUser): Promise<boolean> {
  return (await db.getRepository(UserEntity).findOneBy({ id: user.id }))?.carrierWide ?? false;
}

export async function listStationSettings(db: DataSource, user: SessionUser) {
  const ids = user.stations.map((s) => s.id);
  const rows = ids.length ? await db.getRepository(StationEntity).find({ where: { id: In(ids) }, order: { iata: 'ASC' } }) : [];
  return { stations: rows.map(presentSettings), viewer: { carrierWide: await viewerIsCarrierWide(db, user) } };
}

export function lookupAirport(iata: string) {
  const a = findAirport(iata);
  if (!a) throw notFound(`Airport ${iata}`);
  return { iata: a.iata, name: a.name, city: a.city, country: a.country, timeZone: a.tz };
}

const bp = (percent: number) => Math.round(percent * 100);

export async function createStation(db: DataSource, user: SessionUser, body: StationCreateBody): Promise<StationSettings> {
  if (!(await viewerIsCarrierWide(db, user))) throw forbidden('Only a carrier-wide admin may open a new station; ask one to add it and grant it to you.');
  const airport = findAirport(body.iata);
  if (!airport) throw badRequest(`iata: ${body.iata} is not an airport in the reference airport data`, [{ field: 'iata', rule: `${body.iata} is not an airport in the reference airport data` }]);
  if (!airport.tz) throw badRequest(`iata: the reference airport data has no time zone for ${body.iata}`, [{ field: 'iata', rule: `the reference airport data has no time zone for ${body.iata}` }]);
  return db.transaction(async (em) => {
    if (await em.findOneBy(StationEntity, { iata: body.iata })) throw conflict('station_exists', `Station ${body.iata} already exists.`);
    const station = await em.save(
      em.create(StationEntity, {
        iata: body.iata, name: body.name ?? airport.name, timeZone: airport.tz as string, regime: body.regime, currency: body.currency,
        riskToleranceBp: bp(body.riskTolerancePercent ?? 5), departureGraceMinutes: body.departureGraceMinutes ?? 10, maxOverbookingBp: bp(body.maxOverbookingPercent ?? 150),
      }),
    );
    await em.query('INSERT INTO user_stations (user_id, station_id) VALUES (?, ?)', [user.id, station.id]);
    const out = presentSettings(station);
    await audit(em, { actor: user, action: 'station.created', entityType: 'station', entityId: station.id, stationId: station.id, after: out });
    return out;
  });
}

export async function updateStation(db: DataSource, user: SessionUser, id: number, body: StationUpdateBody): Promise<StationSettings> {
  return db.transaction(async (em) => {
    const station = canSeeStation(user, id) ? await em.findOne(StationEntity, { where: { id }, lock: { mode: 'pessimistic_write' } }) : null;
    if (!station) throw notFound('Station');
    const before = presentSettings(station);
    if (body.name !== undefined) station.name = body.name;
    if (body.regime !== undefined) station.regime = body.regime;
    if (body.currency !== undefined) station.currency = body.currency;
    if (body.riskTolerancePercent !== undefined) station.riskToleranceBp = bp(body.riskTolerancePercent);
    if (body.departureGraceMinutes !== undefined) station.departureGraceMinutes = body.departureGraceMinutes;
    if (body.maxOverbookingPercent !== undefined) station.maxOverbookingBp = bp(body.maxOverbookingPercent);
    await em.save(station);
    const after = presentSettings(station);
    await audit(em, { actor: user, action: 'station.updated', entityType: 'station', entityId: station.id, stationId: station.id, before, after });
    return after;
  });
}
