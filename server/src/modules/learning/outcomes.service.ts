// Each booked passenger's outcome when a flight closes, and a supervisor's correction of it.
import { In, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { OutcomeCorrection } from '@shared/schemas/learning';
import { UNKNOWN_CHANNEL } from '@shared/schemas/booking-channel';
import {
  BookingEntity, BookingOutcomeEntity, ClosedFlightEntity, DenialEntity, FlightEntity, PassengerEntity, StationEntity, VolunteerEntity,
} from '../../db/entities';
import type { BookingOutcome } from '../../db/entities/learning.entity';
import { notFound } from '../../domain/errors';
import { audit } from '../audit/audit.service';

const HOUR = 3_600_000;

/** The weekday of a moment in a time zone: 0 = Sunday … 6 = Saturday. */
export function dayOfWeekIn(at: Date, timeZone: string): number {
  const name = new Intl.DateTimeFormat('en-US', { weekday: 'short', timeZone }).format(at);
  return ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'].indexOf(name);
}

/**
 * What became of a passenger at the gate. Boarded is a show; an accepted volunteer and an authorized denial showed
 * up too but did not fly; a connecting passenger who never checked in is taken as a missed connection; the rest did
 * not show.
 */
export function outcomeOf(p: Pick<PassengerEntity, 'status' | 'inboundFlight' | 'checkedInAt'>, volunteered: boolean, denied: boolean): BookingOutcome {
  if (denied) return 'denied';
  if (volunteered) return 'volunteered';
  if (p.status === 'boarded') return 'showed';
  if (p.inboundFlight && !p.checkedInAt) return 'missed-connection';
  return 'no-show';
}

/** Records a departed flight's outcomes once (a second call finds the closed flight and does nothing). */
export async function recordClosedFlight(em: EntityManager, flightId: number): Promise<number | null> {
  const flight = await em.findOne(FlightEntity, { where: { id: flightId }, lock: { mode: 'pessimistic_write' } });
  if (!flight) return null;
  if (await em.findOneBy(ClosedFlightEntity, { flightId })) return null;
  const station = await em.findOneByOrFail(StationEntity, { id: flight.stationId });
  const [passengers, bookings, volunteers, denials] = await Promise.all([
    em.find(PassengerEntity, { where: { flightId } }),
    em.find(BookingEntity, { select: { id: true, pnr: true, channel: true }, where: { flightId } }),
    em.find(VolunteerEntity, { select: { id: true, passengerIds: true }, where: { flightId, status: 'accepted' } }),
    em.find(DenialEntity, { select: { id: true, passengerIds: true }, where: { flightId, status: 'authorized' } }),
  ]);
  // Without a single boarding scan the feed did not report boarding at all: who showed is unknown, and recording
  // everyone as a no-show would teach the rates a falsehood. Such a flight is left out.
  if (!passengers.some((p) => p.status === 'boarded')) return null;
  const pnrOf = new Map(bookings.map((b) => [b.id, b.pnr]));
  const channelOf = new Map(bookings.map((b) => [b.id, b.channel ?? UNKNOWN_CHANNEL]));
  const volunteered = new Set(volunteers.flatMap((v) => v.passengerIds));
  const denied = new Set(denials.flatMap((d) => d.passengerIds));
  const partySize = new Map<number, number>();
  for (const p of passengers) if (p.status !== 'cancelled') partySize.set(p.bookingId, (partySize.get(p.bookingId) ?? 0) + 1);
  const departure = flight.scheduledDeparture.getTime();
  const { identifiers } = await em.insert(ClosedFlightEntity, {
    flightId, stationId: flight.stationId, carrierCode: flight.carrierCode, flightNumber: flight.flightNumber, serviceDate: flight.serviceDate,
    origin: flight.origin, destination: flight.destination, scheduledDeparture: flight.scheduledDeparture,
    dayOfWeek: dayOfWeekIn(flight.scheduledDeparture, station.timeZone), seatsByCabin: flight.seatsByCabin, demo: false,
  });
  const closedFlightId = Number(identifiers[0].id);
  const by = (p: PassengerEntity, hours: number) => p.checkedInAt !== null && p.checkedInAt.getTime() <= departure - hours * HOUR;
  const rows = passengers.filter((p) => p.status !== 'cancelled').map((p) => ({
    closedFlightId, passengerId: p.id, pnr: pnrOf.get(p.bookingId) ?? '', cabin: p.cabin, fareClass: p.fareType, channel: channelOf.get(p.bookingId) ?? UNKNOWN_CHANNEL,
    connecting: Boolean(p.inboundFlight), partySize: partySize.get(p.bookingId) ?? 1, checkedInAt: p.checkedInAt,
    checkedInT24: by(p, 24), checkedInT3: by(p, 3), checkedInT1: by(p, 1),
    outcome: outcomeOf(p, volunteered.has(p.id), denied.has(p.id)),
  }));
  for (let i = 0; i < rows.length; i += 500) await em.insert(BookingOutcomeEntity, rows.slice(i, i + 500));
  await audit(em, { actor: { label: 'learning clock' }, action: 'flight.outcomes_recorded', entityType: 'closed_flight', entityId: closedFlightId, stationId: flight.stationId, after: { flightId, bookings: rows.length } });
  return closedFlightId;
}

/** Records every departed flight that has no closed record yet; returns how many were recorded. */
export async function recordDepartedFlights(db: DataSource, now = new Date()): Promise<number> {
  const departed = await db.getRepository(FlightEntity).createQueryBuilder('f')
    .select('f.id', 'id')
    .leftJoin(ClosedFlightEntity, 'c', 'c.flight_id = f.id')
    .where('f.state = :state', { state: 'departed' })
    .andWhere('f.scheduled_departure < :now', { now })
    .andWhere('c.id IS NULL')
    .getRawMany<{ id: number }>();
  let recorded = 0;
  for (const { id } of departed) {
    if (await db.transaction((em) => recordClosedFlight(em, Number(id)))) recorded++;
  }
  return recorded;
}

export interface ClosedFlightRow {
  id: number;
  flight: string;
  serviceDate: string;
  route: string;
  demo: boolean;
  booked: number;
  outcomes: Record<BookingOutcome, number>;
}

/** The station's latest closed flights with their outcome counts. */
export async function listClosedFlights(db: DataSource, stationIds: number[], limit = 30): Promise<ClosedFlightRow[]> {
  const flights = await db.getRepository(ClosedFlightEntity).find({ where: { stationId: In(stationIds) }, order: { scheduledDeparture: 'DESC', id: 'DESC' }, take: limit });
  if (!flights.length) return [];
  const counts: { id: number; outcome: BookingOutcome; n: string }[] = await db.query(
    'SELECT closed_flight_id AS id, outcome, COUNT(*) AS n FROM booking_outcomes WHERE closed_flight_id IN (?) GROUP BY closed_flight_id, outcome',
    [flights.map((f) => f.id)],
  );
  return flights.map((f) => {
    const outcomes = { showed: 0, 'no-show': 0, volunteered: 0, denied: 0, 'missed-connection': 0 };
    for (const c of counts) if (Number(c.id) === f.id) outcomes[c.outcome] = Number(c.n);
    return {
      id: f.id, flight: `${f.carrierCode} ${f.flightNumber}`, serviceDate: f.serviceDate, route: `${f.origin}-${f.destination}`, demo: f.demo,
      booked: Object.values(outcomes).reduce((s, n) => s + n, 0), outcomes,
    };
  });
}

/** A closed flight's outcomes, for a supervisor to check and correct. */
export async function closedFlightOutcomes(db: DataSource, closedFlightId: number, canSee: (stationId: number) => boolean) {
  const flight = await db.getRepository(ClosedFlightEntity).findOneBy({ id: closedFlightId });
  if (!flight || !canSee(flight.stationId)) throw notFound('Closed flight');
  const rows = await db.getRepository(BookingOutcomeEntity).find({ where: { closedFlightId }, order: { pnr: 'ASC', id: 'ASC' } });
  return rows.map((r) => ({
    id: r.id, pnr: r.pnr, cabin: r.cabin, fareClass: r.fareClass, connecting: r.connecting, partySize: r.partySize, channel: r.channel,
    checkedInT24: r.checkedInT24, checkedInT3: r.checkedInT3, checkedInT1: r.checkedInT1, outcome: r.outcome,
    corrected: r.correctedAt !== null,
  }));
}

/** A supervisor's correction of one outcome, with the audit row in the same transaction. */
export async function correctOutcome(db: DataSource, outcomeId: number, body: OutcomeCorrection, actor: SessionUser, canSee: (stationId: number) => boolean) {
  return db.transaction(async (em) => {
    const row = await em.findOne(BookingOutcomeEntity, { where: { id: outcomeId }, lock: { mode: 'pessimistic_write' } });
    const flight = row ? await em.findOneBy(ClosedFlightEntity, { id: row.closedFlightId }) : null;
    if (!row || !flight || !canSee(flight.stationId)) throw notFound('Outcome');
    const before = row.outcome;
    await em.update(BookingOutcomeEntity, { id: outcomeId }, { outcome: body.outcome, correctedAt: new Date() });
    await audit(em, { actor, action: 'booking_outcome.corrected', entityType: 'booking_outcome', entityId: outcomeId, stationId: flight.stationId, before: { outcome: before }, after: { outcome: body.outcome, reason: body.reason } });
    return { id: outcomeId, outcome: body.outcome, corrected: true };
  });
}

