import type { DataSource } from 'typeorm';
import { BookingEntity, FlightEntity, VolunteerEntity, FlightForecastEntity, ForecastSnapshotEntity, PassengerEntity, StationEntity } from '../../db/entities';
import { computeFlightForecast } from './flight-forecast';
import { showUpProfileFor } from './profile.service';

/** How often the odds-over-time chart gets a point when nothing much moves. */
const SNAPSHOT_EVERY_MS = 60_000;

export interface RecomputeOutcome {
  flightId: number;
  stationId: number;
  pOversale: number;
}

/** Recomputes one flight from its stored passengers and saves the latest figures (and a snapshot when due). */
export async function recomputeFlight(db: DataSource, flightId: number, now = new Date()): Promise<RecomputeOutcome | null> {
  const flight = await db.getRepository(FlightEntity).findOneBy({ id: flightId });
  if (!flight) return null;
  const [station, profile, passengers] = await Promise.all([
    db.getRepository(StationEntity).findOneByOrFail({ id: flight.stationId }),
    showUpProfileFor(db, flight.stationId),
    db.getRepository(PassengerEntity).findBy({ flightId }),
  ]);
  const bookings = await db.getRepository(BookingEntity).find({ select: { id: true, travelsTogether: true }, where: { flightId } });
  const together = new Map(bookings.map((b) => [b.id, b.travelsTogether]));
  const accepted = await db.getRepository(VolunteerEntity).findBy({ flightId, status: 'accepted' });
  const volunteered = new Set(accepted.flatMap((v) => v.passengerIds));
  const result = computeFlightForecast({
    passengers: passengers.map((p) => ({ ...p, travelsTogether: together.get(p.bookingId) ?? true, volunteered: volunteered.has(p.id) })),
    seatsByCabin: flight.seatsByCabin,
    departure: flight.scheduledDeparture,
    now,
    profile,
    riskTolerance: station.riskToleranceBp / 10_000,
    shock: flight.shock,
  });
  const { forecast } = result;
  const detail = { cabins: result.cabins, estimates: Object.fromEntries([...result.estimates].map(([id, e]) => [id, e])) };
  await db.transaction(async (em) => {
    await em.upsert(FlightForecastEntity, { flightId, computedAt: now, pOversale: forecast.pOversale, expectedDenied: forecast.expectedDenied, forecast, detail }, ['flightId']);
    const last = await em.getRepository(ForecastSnapshotEntity).findOne({ where: { flightId }, order: { at: 'DESC' } });
    const moved = !last || Math.abs(last.pOversale - forecast.pOversale) >= 0.01 || now.getTime() - last.at.getTime() >= SNAPSHOT_EVERY_MS;
    if (moved) {
      const checkedIn = passengers.filter((p) => p.status === 'checked-in' || p.status === 'boarded').length;
      const booked = passengers.filter((p) => p.status !== 'cancelled').length;
      await em.insert(ForecastSnapshotEntity, { flightId, at: now, pOversale: forecast.pOversale, expectedDenied: forecast.expectedDenied, checkedIn, booked });
    }
  });
  return { flightId, stationId: flight.stationId, pOversale: forecast.pOversale };
}
