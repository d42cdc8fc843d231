// Rows the volunteer-round API tests stand on: flights of their own (far in the future, on routes nobody else
// flies, so the demo flights other tests use stay untouched), bookings with passengers, and exact cleanup.
import { randomInt } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { BookingEntity, FlightEntity, OutboxMessageEntity, PassengerEntity, StationEntity } from '../../server/src/db/entities';
import { deleteInDependencyOrder } from '../../server/src/demo/delete-in-order';
import { withFreeFlightNumber } from './free-flight-number';
import { RUN_ID, removeRunUsers } from './helpers';
import { removeCompensations } from '../cleanup/compensations';

const MINUTE = 60_000;
const PNR_LETTERS = 'ABCDEFGHJKLMNPQRSTUVWXYZ23456789';

/** A booking reference of six letters and digits, as PNRs are printed (IATA practice, from memory). */
export function uniquePnr(): string {
  return Array.from({ length: 6 }, () => PNR_LETTERS[randomInt(PNR_LETTERS.length)]).join('');
}

/** Contact addresses under `.test`, a reserved top-level domain (RFC 2606), so nothing can reach a real mailbox. */
export function contactAddress(label: string): string {
  return `volunteer-${label}-${RUN_ID}-${randomInt(1e9)}@bumpboard.test`;
}

export interface FlightOptions {
  stationId: number;
  origin: string;
  destination: string;
  /** Default: a random day in 2034, so no departures board of today shows these flights. */
  departure?: Date;
  durationMinutes?: number;
  seats?: number;
}

/** Flight numbers 7000-7999 on carrier ZV; a clash with an earlier run's leftover is retried with another number. */
export async function makeFlight(db: DataSource, o: FlightOptions): Promise<FlightEntity> {
  const repo = db.getRepository(FlightEntity);
  return withFreeFlightNumber({ from: 7000, size: 1000 }, (flightNumber) => {
    const departure = o.departure ?? new Date(Date.UTC(2034, 0, 1, 14, 0) + randomInt(360) * 86_400_000 + randomInt(96) * 15 * MINUTE);
    return repo.save(repo.create({
      stationId: o.stationId, carrierCode: 'ZV', flightNumber, serviceDate: departure.toISOString().slice(0, 10),
      origin: o.origin, destination: o.destination, scheduledDeparture: departure,
      scheduledArrival: new Date(departure.getTime() + (o.durationMinutes ?? 150) * MINUTE),
      aircraftType: '320', seatsByCabin: { Y: o.seats ?? 150 }, gate: null, state: 'scheduled', shock: null,
    }));
  });
}

export interface Booked {
  booking: BookingEntity;
  passengers: PassengerEntity[];
}

/** One PNR with its party; names as [first, last]. */
export async function addBooking(db: DataSource, flight: FlightEntity, names: [string, string][], contactEmail: string | null = contactAddress('pax')): Promise<Booked> {
  const booking = await db.getRepository(BookingEntity).save({ flightId: flight.id, pnr: uniquePnr(), contactEmail, travelsTogether: true, status: 'active' });
  const passengers = await db.getRepository(PassengerEntity).save(names.map(([firstName, lastName], i) => ({
    bookingId: booking.id, flightId: flight.id, pnrSequence: i + 1, firstName, lastName, cabin: 'Y', fareMinor: 25_000, fareCurrency: 'USD',
    fareType: 'standard', ssrCodes: [], frequentFlyerTier: null, isChild: false, inboundFlight: null, inboundScheduledArrival: null,
    inboundEstimatedArrival: null, seat: null, status: 'checked-in' as const, checkedInAt: new Date(), boardedAt: null, statusChangedAt: null,
  })));
  return { booking, passengers };
}

/** Many one-passenger bookings at once. */
export async function addSingles(db: DataSource, flight: FlightEntity, count: number, lastName = 'Single'): Promise<Booked[]> {
  const out: Booked[] = [];
  for (let i = 0; i < count; i++) out.push(await addBooking(db, flight, [[`Pax${i + 1}`, lastName]]));
  return out;
}

/**
 * A station no demo user belongs to, for tests that change a station's volunteer policy without touching the one
 * the demo and other tests read. Bangor, Maine: a real US airport, so 14 CFR Part 250 applies. Made once, reused.
 */
export async function policyTestStation(db: DataSource): Promise<StationEntity> {
  const repo = db.getRepository(StationEntity);
  return (await repo.findOneBy({ iata: 'BGR' })) ?? repo.save(repo.create({ iata: 'BGR', name: 'Bangor (volunteer API test station)', timeZone: 'America/New_York', regime: 'us-dot', currency: 'USD' }));
}

export async function outboxByKey(db: DataSource, dedupeKey: string): Promise<OutboxMessageEntity[]> {
  return db.getRepository(OutboxMessageEntity).findBy({ dedupeKey });
}

/** Waits for the coalesced forecast recomputes the test's changes queued, so cleanup removes their rows too. */
export const settle = (t: { forecast: { flush(): Promise<void> } }) => t.forecast.flush();

/** A file's clean-up: the recomputes it started finish, then its flights and users go and the app closes. */
export async function closeAfterFlights(t: { db: DataSource; forecast: { flush(): Promise<void> }; close(): Promise<void> }, flightIds: number[]): Promise<void> {
  await settle(t);
  await removeFlights(t.db, flightIds);
  await removeRunUsers(t.db);
  await t.close();
}

/**
 * Everything hanging off the given flights: outbox rows, voucher offers, compensations, seat holds, volunteers, approvals, rounds,
 * forecasts; then the flights (bookings and passengers go with them). Audit rows stay: the log is append-only.
 */
export async function removeFlights(db: DataSource, flightIds: number[]): Promise<void> {
  if (!flightIds.length) return;
  // The app never deletes money rows; a test removes its own first, then lets the declared keys order the rest.
  const comps: { id: number }[] = await db.query('SELECT id FROM compensations WHERE flight_id IN (?)', [flightIds]);
  const compIds = comps.map((c) => c.id);
  await db.query('DELETE FROM outbox_messages WHERE flight_id IN (?)', [flightIds]);
  await removeCompensations((sql, params) => db.query(sql, params), compIds);
  await deleteInDependencyOrder(db.manager, 'flights', flightIds);
}

/** The signed flight link's token, from the bid link the rounds list hands the agent. */
export function tokenOf(bidLink: string): string {
  return bidLink.slice(bidLink.lastIndexOf('/') + 1);
}
