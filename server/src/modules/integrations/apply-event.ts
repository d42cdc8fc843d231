// Applies one feed event inside a transaction. Events are applied by their own timestamps: a passenger's status
// only moves for an event newer than the one that last moved it, so a late "checked in" never undoes "boarded".
import type { EntityManager } from 'typeorm';
import type { IntegrationEvent } from '@shared/schemas/integration-events';
import { BookingEntity, FlightEntity, PassengerEntity } from '../../db/entities';
import type { PassengerStatus } from '../../db/entities/passenger.entity';
import { HttpError } from '../../http/errors';
import { feedBookingProblem } from '../manifests/booking-guard';

export interface Applied {
  flightId: number;
  status: 'applied' | 'superseded';
  summary: string;
}

const rejected = (field: string, rule: string) => new HttpError(422, 'event_rejected', `${field}: ${rule}`, [{ field, rule }]);

async function findFlight(em: EntityManager, stationId: number, e: IntegrationEvent) {
  const flight = await em.findOneBy(FlightEntity, { stationId, carrierCode: e.flight.carrier, flightNumber: e.flight.number, serviceDate: e.flight.date });
  if (!flight) throw rejected('flight', `no flight ${e.flight.carrier}${e.flight.number} on ${e.flight.date} departs from this station`);
  return flight;
}

async function targets(em: EntityManager, flightId: number, pnr: string, sequence: number | undefined) {
  const booking = await em.findOneBy(BookingEntity, { flightId, pnr });
  if (!booking) throw rejected('pnr', `no booking ${pnr} on this flight`);
  const passengers = await em.find(PassengerEntity, { where: { bookingId: booking.id }, order: { pnrSequence: 'ASC' }, lock: { mode: 'pessimistic_write' } });
  const chosen = sequence === undefined ? passengers : passengers.filter((p) => p.pnrSequence === sequence);
  if (!chosen.length) throw rejected('sequence', `booking ${pnr} has no passenger ${sequence}`);
  return { booking, passengers: chosen };
}

type StatusChange = (p: PassengerEntity, at: Date) => void;

const STATUS_CHANGES: Record<string, { to: PassengerStatus; change: StatusChange; words: string }> = {
  'passenger.checked-in': { to: 'checked-in', words: 'checked in', change: (p, at) => { p.checkedInAt = at; p.boardedAt = null; } },
  'check-in.cancelled': { to: 'booked', words: 'check-in cancelled', change: (p) => { p.checkedInAt = null; p.boardedAt = null; } },
  'passenger.boarded': { to: 'boarded', words: 'boarded', change: (p, at) => { p.checkedInAt ??= at; p.boardedAt = at; } },
  'passenger.offloaded': { to: 'offloaded', words: 'offloaded', change: (p) => { p.boardedAt = null; } },
};

export async function applyEvent(em: EntityManager, stationId: number, e: IntegrationEvent): Promise<Applied> {
  const flight = await findFlight(em, stationId, e);
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
    booking.itinerary = e.itinerary;
    booking.status = 'active';
    booking.contactEmail = e.contactEmail;
    booking.language = e.language;
    await em.save(booking);
    await em.delete(PassengerEntity, { bookingId: booking.id });
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

  const rule = STATUS_CHANGES[e.type];
  const { passengers } = await targets(em, flight.id, e.pnr, e.sequence);
  const moved: PassengerEntity[] = [];
  for (const p of passengers) {
    if (p.status === 'cancelled') throw rejected('pnr', `booking ${e.pnr} is cancelled`);
    if (p.statusChangedAt && p.statusChangedAt > at) {
      // Out of order: keep the newer status, but fill in a check-in time history did not have.
      if (e.type === 'passenger.checked-in' && !p.checkedInAt) {
        p.checkedInAt = at;
        moved.push(p);
      }
      continue;
    }
    rule.change(p, at);
    p.status = rule.to;
    p.statusChangedAt = at;
    moved.push(p);
  }
  // Guarded, column by column: no read-back before the write, as a save() of the entity would do.
  for (const p of moved) await em.update(PassengerEntity, { id: p.id }, { status: p.status, statusChangedAt: p.statusChangedAt, checkedInAt: p.checkedInAt, boardedAt: p.boardedAt });
  const who = e.sequence === undefined ? `${e.pnr} (${passengers.length})` : `${e.pnr}/${e.sequence}`;
  const newest = moved.some((p) => p.statusChangedAt?.getTime() === at.getTime());
  return { flightId: flight.id, status: newest ? 'applied' : 'superseded', summary: newest ? `${who} ${rule.words}` : `${who} ${rule.words}: older than the latest change, kept the newer status` };
}
