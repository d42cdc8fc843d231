import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { FlightDesk } from '@shared/schemas/flight-desk';
import type { CommonShock } from '@shared/forecast';
import { FlightEntity } from '../../db/entities';
import { notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { announceCommitted, flightChanged } from '../../events';
import { audit } from '../audit/audit.service';
import { recomputeFlightDetailed, type RecomputeOutcome } from '../forecast/forecast.service';
import { liveStoreOf, type LiveEntry, type PayloadKind } from '../forecast/live-store';

/** The flight, if it departs from one of the user's stations; otherwise "not found", never a hint it exists. */
export async function flightForUser(db: DataSource, user: SessionUser, flightId: number) {
  const flight = await db.getRepository(FlightEntity).findOneBy({ id: flightId });
  if (!flight || !canSeeStation(user, flight.stationId)) throw notFound('Flight');
  return flight;
}

/**
 * The flight's current version as held in memory (read from the database once, without writing, if this process
 * has none yet), if the flight departs from one of the user's stations.
 */
export async function liveFlightForUser(db: DataSource, user: SessionUser, flightId: number): Promise<LiveEntry> {
  const entry = await liveStoreOf(db).current(flightId);
  if (!entry || !canSeeStation(user, entry.stationId)) throw notFound('Flight');
  return entry;
}

/** The ETag of one payload of one version: the version itself, so a console that holds it gets a 304. */
export const etagOf = (entry: LiveEntry, kind: PayloadKind) => `"${entry.flightId}.${entry.version}.${kind}"`;

export const deskPayload = (db: DataSource, entry: LiveEntry, kind: PayloadKind) => liveStoreOf(db).payload(entry, kind);

export async function setShock(db: DataSource, user: SessionUser, flight: FlightEntity, shock: CommonShock | null, reason: string): Promise<{ desk: FlightDesk; outcome: RecomputeOutcome | null }> {
  await db.transaction(async (em) => {
    const before = { shock: flight.shock };
    await em.update(FlightEntity, { id: flight.id }, { shock });
    await audit(em, { actor: user, action: 'flight.shock_set', entityType: 'flight', entityId: flight.id, stationId: flight.stationId, before, after: { shock, reason } });
  });
  const r = await recomputeFlightDetailed(db, flight.id);
  // Recomputed at once, so the supervisor sees the new figures in the answer; the consoles get them in the notice.
  announceCommitted(db, flightChanged(flight.id, flight.stationId, ['forecast', 'shock'], r.status === 'written' ? r.outcome.notice : undefined));
  const entry = await liveStoreOf(db).current(flight.id);
  if (!entry) throw notFound('Flight');
  return { desk: entry.desk, outcome: r.status === 'written' ? r.outcome : null };
}
