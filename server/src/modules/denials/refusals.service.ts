// Refusals of carriage for safety, security, health or conduct: their own outcome, recorded with a reason and audited,
// never a denial of boarding and never compensated. The passenger leaves the flight like a denied one, so the counts
// and the forecast stop expecting them, but no compensation row, report line or statement follows.
import { In, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { BoardingRefusal, RecordRefusalBody } from '@shared/schemas/denials';
import { BoardingRefusalEntity, BookingEntity, FlightEntity, PassengerEntity } from '../../db/entities';
import { badRequest, conflict } from '../../domain/errors';
import { flightMoved, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { activeDenials } from './candidates.service';

type Db = DataSource | EntityManager;

/** The flight's passengers named in a body: all on this flight, all in one booking, none already gone. */
export async function passengersOfOneBooking(em: EntityManager, flight: FlightEntity, ids: number[]): Promise<PassengerEntity[]> {
  const unique = [...new Set(ids)];
  const found = await em.findBy(PassengerEntity, { id: In(unique), flightId: flight.id });
  const missing = unique.filter((pid) => !found.some((p) => p.id === pid));
  if (missing.length > 0) {
    throw badRequest(`passengerIds: ${missing.join(', ')} ${missing.length === 1 ? 'is' : 'are'} not on this flight`, [{ field: 'passengerIds', rule: 'must name passengers of this flight' }]);
  }
  if (new Set(found.map((p) => p.bookingId)).size > 1) {
    throw badRequest('passengerIds: name passengers of one booking at a time', [{ field: 'passengerIds', rule: 'must all be in one booking' }]);
  }
  const gone = found.filter((p) => p.status === 'cancelled' || p.status === 'offloaded');
  if (gone.length > 0) {
    throw badRequest(`passengerIds: ${gone.map((p) => `${p.firstName} ${p.lastName}`).join(', ')} already left this flight (${gone.map((p) => p.status).join(', ')})`, [{ field: 'passengerIds', rule: 'must name passengers still on the flight' }]);
  }
  const inDenial = (await activeDenials(em, flight.id)).filter((d) => d.passengerIds.some((pid) => unique.includes(pid)));
  if (inDenial.length > 0) {
    throw conflict('in_denial', `Denial ${inDenial.map((d) => d.id).join(', ')} already names ${inDenial.length === 1 ? 'this passenger' : 'these passengers'}: change or withdraw that selection first.`);
  }
  return found;
}

export async function recordRefusal(db: DataSource, user: SessionUser, flightId: number, body: RecordRefusalBody) {
  return db.transaction(async (em) => {
    const flight = await em.findOneOrFail(FlightEntity, { where: { id: flightId }, lock: { mode: 'pessimistic_write' } });
    const passengers = await passengersOfOneBooking(em, flight, body.passengerIds);
    const now = new Date();
    const refusal = await em.save(em.create(BoardingRefusalEntity, {
      flightId, stationId: flight.stationId, bookingId: passengers[0].bookingId, passengerIds: passengers.map((p) => p.id), ground: body.ground,
      reason: body.reason, refusedByUserId: user.id, refusedByLabel: user.displayName, refusedAt: now,
    }));
    await em.update(PassengerEntity, { id: In(refusal.passengerIds), flightId }, { status: 'offloaded', statusChangedAt: now });
    await audit(em, {
      actor: user, action: 'boarding_refusal.recorded', entityType: 'boarding_refusal', entityId: refusal.id, stationId: flight.stationId,
      before: { statuses: passengers.map((p) => ({ passengerId: p.id, status: p.status })) },
      after: { flightId, ground: body.ground, reason: body.reason, passengerIds: refusal.passengerIds, compensation: 'none: not a denial of boarding' },
    });
    recordEffect(em, ...flightMoved(flight.id, flight.stationId, ['denials', 'counts', 'forecast']));
    return { refusal, flight };
  });
}

export async function refusalsOf(db: Db, flight: FlightEntity): Promise<BoardingRefusal[]> {
  const rows = await db.getRepository(BoardingRefusalEntity).find({ where: { flightId: flight.id }, order: { refusedAt: 'DESC', id: 'DESC' } });
  if (rows.length === 0) return [];
  const [passengers, bookings] = await Promise.all([
    db.getRepository(PassengerEntity).findBy({ id: In(rows.flatMap((r) => r.passengerIds)) }),
    db.getRepository(BookingEntity).findBy({ id: In(rows.map((r) => r.bookingId)) }),
  ]);
  return rows.map((r) => ({
    id: r.id, flightId: r.flightId, pnr: bookings.find((b) => b.id === r.bookingId)?.pnr ?? '?', passengerIds: r.passengerIds,
    names: r.passengerIds.map((pid) => passengers.find((p) => p.id === pid)).filter((p) => p !== undefined).map((p) => `${p.firstName} ${p.lastName}`),
    ground: r.ground, reason: r.reason, refusedBy: r.refusedByLabel, refusedAt: r.refusedAt.toISOString(),
  }));
}
