// Applies one feed event inside a transaction. Events are applied by their own timestamps: a passenger's status
// only moves for an event newer than the one that last moved it, so a late "checked in" never undoes "boarded".
import type { EntityManager } from 'typeorm';
import type { IntegrationEvent } from '@shared/schemas/integration-events';
import { BookingEntity, FlightEntity, PassengerEntity } from '../../db/entities';
import type { PassengerStatus } from '../../db/entities/passenger.entity';
import { unprocessable } from '../../domain/errors';
import { feedBookingProblem } from '../manifests/booking-guard';
import { driverErrorCode } from '../../db/driver-errors';

export interface Applied {
  flightId: number;
  status: 'applied' | 'superseded';
  summary: string;
}

const rejected = (field: string, rule: string) => unprocessable('event_rejected', `${field}: ${rule}`, [{ field, rule }]);

async function targets(em: EntityManager, flightId: number, pnr: string, sequence: number | undefined) {
  const booking = await em.findOneBy(BookingEntity, { flightId, pnr });
  if (!booking) throw rejected('pnr', `no booking ${pnr} on this flight`);
  const passengers = await em.find(PassengerEntity, { where: { bookingId: booking.id }, order: { pnrSequence: 'ASC' }, lock: { mode: 'pessimistic_write' } });
  const chosen = sequence === undefined ? passengers : passengers.filter((p) => p.pnrSequence === sequence);
  if (!chosen.length) throw rejected('sequence', `booking ${pnr} has no passenger ${sequence}`);
  return { booking, passengers: chosen };
}

/**
 * Each status event as one guarded UPDATE of the booking's passengers: the new status, and the check-in and boarding
 * times as the event sets them (`?` is the event's time). The guard in the WHERE clause keeps a newer status.
 */
const STATUS_CHANGES: Record<string, { to: PassengerStatus; set: string; times: number; words: string }> = {
  'passenger.checked-in': { to: 'checked-in', words: 'checked in', set: 'checked_in_at = ?, boarded_at = NULL', times: 1 },
  'check-in.cancelled': { to: 'booked', words: 'check-in cancelled', set: 'checked_in_at = NULL, boarded_at = NULL', times: 0 },
  'passenger.boarded': { to: 'boarded', words: 'boarded', set: 'checked_in_at = COALESCE(checked_in_at, ?), boarded_at = ?', times: 2 },
  'passenger.offloaded': { to: 'offloaded', words: 'offloaded', set: 'boarded_at = NULL', times: 0 },
};

type StatusEvent = Extract<IntegrationEvent, { type: 'passenger.checked-in' | 'check-in.cancelled' | 'passenger.boarded' | 'passenger.offloaded' }>;
const isStatusEvent = (e: IntegrationEvent): e is StatusEvent => e.type in STATUS_CHANGES;

interface HeldRow {
  id: number;
  seq: number;
  status: string;
  changed: Date | string | null;
  checked_in: Date | string | null;
}

/** Flights looked up once per batch: a burst of check-ins names the same few flights again and again. */
export class BatchFlights {
  private readonly flights = new Map<string, Promise<FlightEntity | null>>();
  constructor(private readonly em: EntityManager, private readonly stationId: number) {}

  async of(e: IntegrationEvent): Promise<FlightEntity> {
    const key = `${e.flight.carrier}|${e.flight.number}|${e.flight.date}`;
    let found = this.flights.get(key);
    if (!found) {
      found = this.em.findOneBy(FlightEntity, { stationId: this.stationId, carrierCode: e.flight.carrier, flightNumber: e.flight.number, serviceDate: e.flight.date });
      this.flights.set(key, found);
    }
    const flight = await found;
    if (!flight) throw rejected('flight', `no flight ${e.flight.carrier}${e.flight.number} on ${e.flight.date} departs from this station`);
    return flight;
  }

  /** Passengers locked ahead for the batch's status events, by flight and booking reference. */
  private readonly locked = new Map<string, HeldRow[]>();

  /**
   * Reads and locks, in one statement, the passengers of every booking the batch's status events name, instead of
   * one locking read per event. Only for a batch of status events alone: a booking added or cancelled in the same
   * batch would change the rows after they were read.
   */
  async lockAhead(events: readonly IntegrationEvent[]): Promise<void> {
    if (events.length < 2 || !events.every(isStatusEvent)) return;
    const pairs = new Map<string, [number, string]>();
    for (const e of events) {
      const flight = await this.of(e).catch(() => null);
      if (flight) pairs.set(`${flight.id}|${e.pnr}`, [flight.id, e.pnr]);
    }
    if (pairs.size === 0) return;
    const rows: (HeldRow & { flight_id: number; pnr: string })[] = await this.em.query(
      `SELECT p.id, p.pnr_sequence AS seq, p.status, p.status_changed_at AS changed, p.checked_in_at AS checked_in, b.flight_id, b.pnr
         FROM passengers p JOIN bookings b ON b.id = p.booking_id WHERE (b.flight_id, b.pnr) IN (?) ORDER BY p.id FOR UPDATE`,
      [[...pairs.values()]],
    );
    for (const key of pairs.keys()) this.locked.set(key, []);
    for (const r of rows) this.locked.get(`${r.flight_id}|${r.pnr}`)?.push(r);
    for (const list of this.locked.values()) list.sort((a, b) => Number(a.seq) - Number(b.seq));
  }

  /** The rows locked ahead for this booking (kept up to date by each update), or undefined to read them now. */
  lockedRows(flightId: number, pnr: string): HeldRow[] | undefined {
    return this.locked.get(`${flightId}|${pnr}`);
  }
}


/**
 * A status event in two statements: the booking's passengers read and locked (one join), then one guarded UPDATE.
 * Every check comes before the write, so a rejected event has changed nothing and needs no savepoint.
 */
async function applyStatus(em: EntityManager, flights: BatchFlights, flight: FlightEntity, e: StatusEvent, at: Date): Promise<Applied> {
  const rule = STATUS_CHANGES[e.type];
  const rows: HeldRow[] = flights.lockedRows(flight.id, e.pnr) ?? await em.query(
    `SELECT p.id, p.pnr_sequence AS seq, p.status, p.status_changed_at AS changed, p.checked_in_at AS checked_in
       FROM passengers p JOIN bookings b ON b.id = p.booking_id WHERE b.flight_id = ? AND b.pnr = ? ORDER BY p.pnr_sequence FOR UPDATE`,
    [flight.id, e.pnr],
  );
  if (!rows.length) throw rejected('pnr', `no booking ${e.pnr} on this flight`);
  const chosen = e.sequence === undefined ? rows : rows.filter((p) => Number(p.seq) === e.sequence);
  if (!chosen.length) throw rejected('sequence', `booking ${e.pnr} has no passenger ${e.sequence}`);
  if (chosen.some((p) => p.status === 'cancelled')) throw rejected('pnr', `booking ${e.pnr} is cancelled`);
  const newer = (p: HeldRow) => p.changed !== null && new Date(p.changed).getTime() > at.getTime();
  const moved = chosen.filter((p) => !newer(p)).map((p) => Number(p.id));
  // Out of order: the newer status stays, but a check-in time history did not have is filled in.
  const filled = e.type === 'passenger.checked-in' ? chosen.filter((p) => newer(p) && p.checked_in === null).map((p) => Number(p.id)) : [];
  if (moved.length) {
    await em.query(
      `UPDATE passengers SET status = ?, status_changed_at = ?, ${rule.set} WHERE id IN (?) AND (status_changed_at IS NULL OR status_changed_at <= ?)`,
      [rule.to, at, ...Array<Date>(rule.times).fill(at), moved, at],
    );
  }
  if (filled.length) await em.query('UPDATE passengers SET checked_in_at = ? WHERE id IN (?) AND checked_in_at IS NULL', [at, filled]);
  // The rows held for the batch follow what was written, for the batch's later events about the same passengers.
  for (const p of chosen) {
    if (moved.includes(Number(p.id))) {
      p.status = rule.to;
      p.changed = at;
      if (e.type === 'passenger.checked-in') p.checked_in = at;
      else if (e.type === 'check-in.cancelled') p.checked_in = null;
      else if (e.type === 'passenger.boarded') p.checked_in ??= at;
    } else if (filled.includes(Number(p.id))) p.checked_in = at;
  }
  if (e.type === 'passenger.checked-in' && e.seat && moved.length) await em.query('UPDATE passengers SET seat = ? WHERE id IN (?)', [e.seat, moved]);
  const who = e.sequence === undefined ? `${e.pnr} (${chosen.length})` : `${e.pnr}/${e.sequence}`;
  const newest = moved.length > 0;
  return { flightId: flight.id, status: newest ? 'applied' : 'superseded', summary: newest ? `${who} ${rule.words}` : `${who} ${rule.words}: older than the latest change, kept the newer status` };
}

/**
 * The earlier passengers of a booking sent again go, unless a record names one (a volunteer, a denial, a
 * compensation): those rows outlive any booking change, so the feed is told to use a new PNR and nothing changes.
 */
async function replacePassengersOf(em: EntityManager, bookingId: number, pnr: string): Promise<void> {
  try {
    await em.delete(PassengerEntity, { bookingId });
    await em.query('RELEASE SAVEPOINT booking_again');
  } catch (err) {
    if (driverErrorCode(err) !== 'ER_ROW_IS_REFERENCED_2') throw err;
    await em.query('ROLLBACK TO SAVEPOINT booking_again');
    throw rejected('pnr', `${pnr} was cancelled after a volunteer, denial or compensation record named its passengers; send it again under a new PNR`);
  }
}

export async function applyEvent(em: EntityManager, flights: BatchFlights, e: IntegrationEvent): Promise<Applied> {
  const flight = await flights.of(e);
  const at = new Date(e.occurredAt);
  const label = `${flight.carrierCode}${flight.flightNumber}`;

  if (e.type === 'inbound.updated') {
    const result = await em.update(PassengerEntity, { flightId: flight.id, inboundFlight: e.inboundFlight }, { inboundEstimatedArrival: new Date(e.estimatedArrival) });
    if (!result.affected) throw rejected('inboundFlight', `no passenger on ${label} connects from ${e.inboundFlight}`);
    return { flightId: flight.id, status: 'applied', summary: `Inbound ${e.inboundFlight} now expected ${e.estimatedArrival} (${result.affected} connecting)` };
  }

  if (e.type === 'booking.added') {
    const existing = await em.findOneBy(BookingEntity, { flightId: flight.id, pnr: e.pnr });
    if (existing && existing.status === 'active') return { flightId: flight.id, status: 'superseded', summary: `Booking ${e.pnr} is already on ${label}` };
    const problem = await feedBookingProblem(em, flight, existing?.id ?? null, e.passengers.length, e.itinerary);
    if (problem) throw rejected(problem.field, problem.rule);
    const booking = existing ?? em.create(BookingEntity, { flightId: flight.id, pnr: e.pnr, travelsTogether: true });
    // A cancelled booking sent again (rare) replaces its passengers, which a record may still name: only then a
    // savepoint, so a refusal leaves the booking as it was.
    if (existing) await em.query('SAVEPOINT booking_again');
    booking.itinerary = e.itinerary;
    booking.status = 'active';
    booking.contactEmail = e.contactEmail;
    booking.language = e.language;
    booking.channel = e.channel;
    await em.save(booking);
    if (existing) await replacePassengersOf(em, booking.id, e.pnr);
    await em.insert(PassengerEntity, e.passengers.map((p, i) => ({
      ...p,
      bookingId: booking.id,
      flightId: flight.id,
      pnrSequence: i + 1,
      inboundScheduledArrival: p.inboundScheduledArrival ? new Date(p.inboundScheduledArrival) : null,
      inboundEstimatedArrival: p.inboundScheduledArrival ? new Date(p.inboundScheduledArrival) : null,
      status: 'booked' as const,
      statusChangedAt: at,
      seat: null,
      checkedInAt: null,
      boardedAt: null,
    })));
    return { flightId: flight.id, status: 'applied', summary: `Booking ${e.pnr} added (${e.passengers.length} passenger${e.passengers.length > 1 ? 's' : ''})` };
  }

  if (e.type === 'booking.cancelled') {
    const { booking, passengers } = await targets(em, flight.id, e.pnr, undefined);
    const moved = passengers.filter((p) => !p.statusChangedAt || p.statusChangedAt <= at);
    if (!moved.length) return { flightId: flight.id, status: 'superseded', summary: `Cancellation of ${e.pnr} is older than its latest change` };
    for (const p of moved) Object.assign(p, { status: 'cancelled', statusChangedAt: at });
    await em.save(moved);
    if (moved.length === passengers.length) await em.update(BookingEntity, { id: booking.id }, { status: 'cancelled' });
    return { flightId: flight.id, status: 'applied', summary: `Booking ${e.pnr} cancelled` };
  }

  return applyStatus(em, flights, flight, e, at);
}
