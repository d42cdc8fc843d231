import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { DeskPassenger, FlightDesk } from '@shared/schemas/flight-desk';
import type { CommonShock } from '@shared/forecast';
import { BookingEntity, FlightEntity, FlightEventEntity, FlightForecastEntity, ForecastSnapshotEntity, PassengerEntity, StationEntity } from '../../db/entities';
import { notFound } from '../../http/errors';
import { canSeeStation } from '../../http/require-role';
import { audit } from '../audit/audit.service';
import { airportZone } from '../../reference/journey-airports';
import { recomputeFlight } from '../forecast/forecast.service';
import type { CabinFigures } from '../forecast/flight-forecast';
import type { ShowEstimate } from '../forecast/show-probability';

interface ForecastDetail { cabins: CabinFigures[]; estimates: Record<string, ShowEstimate> }

/** The flight, if it departs from one of the user's stations; otherwise "not found", never a hint it exists. */
export async function flightForUser(db: DataSource, user: SessionUser, flightId: number) {
  const flight = await db.getRepository(FlightEntity).findOneBy({ id: flightId });
  if (!flight || !canSeeStation(user, flight.stationId)) throw notFound('Flight');
  return flight;
}

async function latestForecast(db: DataSource, flightId: number) {
  const repo = db.getRepository(FlightForecastEntity);
  const row = await repo.findOneBy({ flightId });
  if (row) return row;
  await recomputeFlight(db, flightId);
  return repo.findOneBy({ flightId });
}

export async function flightDesk(db: DataSource, flight: FlightEntity): Promise<FlightDesk> {
  const [station, forecast] = await Promise.all([db.getRepository(StationEntity).findOneByOrFail({ id: flight.stationId }), latestForecast(db, flight.id)]);
  const cabins = (forecast?.detail as ForecastDetail | undefined)?.cabins ?? [];
  const sum = (k: 'seats' | 'booked' | 'checkedIn' | 'boarded') => cabins.reduce((a, c) => a + c[k], 0);
  return {
    flight: {
      id: flight.id, carrierCode: flight.carrierCode, flightNumber: flight.flightNumber, serviceDate: flight.serviceDate, origin: flight.origin,
      destination: flight.destination, scheduledDeparture: flight.scheduledDeparture.toISOString(), scheduledArrival: flight.scheduledArrival.toISOString(),
      gate: flight.gate, state: flight.state, aircraftType: flight.aircraftType, seatsByCabin: flight.seatsByCabin,
      destinationTimeZone: airportZone(flight.destination),
    },
    station: { id: station.id, iata: station.iata, name: station.name, timeZone: station.timeZone, regime: station.regime, currency: station.currency },
    cabins,
    totals: { seats: sum('seats'), booked: sum('booked'), checkedIn: sum('checkedIn'), boarded: sum('boarded') },
    forecast: forecast?.forecast ?? null,
  };
}

export async function deskPassengers(db: DataSource, flight: FlightEntity): Promise<DeskPassenger[]> {
  const [passengers, bookings, forecast] = await Promise.all([
    db.getRepository(PassengerEntity).find({ where: { flightId: flight.id }, order: { lastName: 'ASC', firstName: 'ASC' } }),
    db.getRepository(BookingEntity).findBy({ flightId: flight.id }),
    latestForecast(db, flight.id),
  ]);
  const byId = new Map(bookings.map((b) => [b.id, b]));
  const partySize = new Map<number, number>();
  for (const p of passengers) if (p.status !== 'cancelled') partySize.set(p.bookingId, (partySize.get(p.bookingId) ?? 0) + 1);
  const estimates = (forecast?.detail as ForecastDetail | undefined)?.estimates ?? {};
  return passengers.map((p) => ({
    id: p.id, bookingId: p.bookingId, pnr: byId.get(p.bookingId)?.pnr ?? '', pnrSequence: p.pnrSequence, partySize: partySize.get(p.bookingId) ?? 1,
    firstName: p.firstName, lastName: p.lastName, cabin: p.cabin, fareMinor: p.fareMinor, fareCurrency: p.fareCurrency, fareType: p.fareType,
    ssrCodes: p.ssrCodes, frequentFlyerTier: p.frequentFlyerTier, isChild: p.isChild, inboundFlight: p.inboundFlight,
    inboundEstimatedArrival: p.inboundEstimatedArrival?.toISOString() ?? null, status: p.status,
    onward: (byId.get(p.bookingId)?.itinerary ?? []).map((s) => `${s.carrier} ${s.number} ${s.origin}-${s.destination}`),
    checkedInAt: p.checkedInAt?.toISOString() ?? null, boardedAt: p.boardedAt?.toISOString() ?? null,
    showProbability: estimates[p.id]?.probability ?? 0, why: estimates[p.id]?.why ?? 'Not computed yet.',
  }));
}

export async function forecastHistory(db: DataSource, flightId: number) {
  const points = await db.getRepository(ForecastSnapshotEntity).find({ where: { flightId }, order: { at: 'ASC' }, take: 2000 });
  return { points: points.map((p) => ({ at: p.at.toISOString(), pOversale: p.pOversale, expectedDenied: p.expectedDenied, checkedIn: p.checkedIn, booked: p.booked })) };
}

export async function eventTrail(db: DataSource, flightId: number) {
  const rows = await db.getRepository(FlightEventEntity).find({ where: { flightId }, order: { receivedAt: 'DESC', id: 'DESC' }, take: 200 });
  return { events: rows.map((e) => ({ id: Number(e.id), eventId: e.eventId, type: e.type, occurredAt: e.occurredAt.toISOString(), receivedAt: e.receivedAt.toISOString(), status: e.status, summary: e.summary })) };
}

export async function setShock(db: DataSource, user: SessionUser, flight: FlightEntity, shock: CommonShock | null, reason: string) {
  await db.transaction(async (em) => {
    const before = { shock: flight.shock };
    await em.update(FlightEntity, { id: flight.id }, { shock });
    await audit(em, { actor: user, action: 'flight.shock_set', entityType: 'flight', entityId: flight.id, stationId: flight.stationId, before, after: { shock, reason } });
  });
  await recomputeFlight(db, flight.id);
}
