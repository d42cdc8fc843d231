// Reads every closed flight with its outcomes for training, in two queries.
import type { DataSource } from 'typeorm';
import type { BookingOutcomeValue } from '@shared/schemas/learning';
import type { TrainingFlight } from './train';

const asDate = (v: Date | string) => (v instanceof Date ? v : new Date(`${v}Z`));

export async function readTrainingFlights(db: DataSource): Promise<TrainingFlight[]> {
  const flights: { id: number; station_id: number; destination: string; scheduled_departure: Date | string; seats_by_cabin: string | Record<string, number> }[] =
    await db.query('SELECT id, station_id, destination, scheduled_departure, seats_by_cabin FROM closed_flights');
  const byId = new Map<number, TrainingFlight>(flights.map((f) => [Number(f.id), {
    id: Number(f.id), stationId: Number(f.station_id), destination: f.destination, scheduledDeparture: asDate(f.scheduled_departure),
    seatsByCabin: typeof f.seats_by_cabin === 'string' ? JSON.parse(f.seats_by_cabin) : f.seats_by_cabin, outcomes: [],
  }]));
  const rows: { f: number; cabin: string; fare_class: string; connecting: number; channel: string; checked_in_at: Date | string | null; t3: number; outcome: BookingOutcomeValue }[] =
    await db.query('SELECT closed_flight_id AS f, cabin, fare_class, connecting, channel, checked_in_at, checked_in_t3 AS t3, outcome FROM booking_outcomes');
  for (const r of rows) {
    byId.get(Number(r.f))?.outcomes.push({
      cabin: r.cabin, fareClass: r.fare_class, connecting: Number(r.connecting) === 1, channel: r.channel,
      checkedInAt: r.checked_in_at === null ? null : asDate(r.checked_in_at), checkedInT3: Number(r.t3) === 1, outcome: r.outcome,
    });
  }
  return [...byId.values()];
}
