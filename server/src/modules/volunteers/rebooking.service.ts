import { In, MoreThan, Not, type DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { FlightEntity, PassengerEntity, RebookingEntity, VolunteerEntity, VolunteerRoundEntity } from '../../db/entities';
import { badRequest, conflict, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { enqueueMessage } from '../outbox/outbox.service';
import { enqueueRebookingNotice, type Enqueue } from './volunteer-notices';

const MINUTE = 60_000;
const delayMinutes = (original: FlightEntity, arrival: Date) => Math.max(0, Math.round((arrival.getTime() - original.scheduledArrival.getTime()) / MINUTE));

/**
 * Seats left on a flight: physical seats less passengers holding one and seats held for rebooked passengers. To
 * hold seats on the strength of it, lock the flight row first, in a READ COMMITTED transaction (see rebookVolunteer).
 */
export async function freeSeats(db: Pick<DataSource, 'getRepository'>, flight: FlightEntity) {
  const seats = Object.values(flight.seatsByCabin).reduce((a, b) => a + b, 0);
  // Cancelled and offloaded passengers hold no seat.
  const booked = await db.getRepository(PassengerEntity).countBy({ flightId: flight.id, status: Not(In(['cancelled', 'offloaded'])) });
  const held = (await db.getRepository(RebookingEntity).findBy({ alternateFlightId: flight.id })).reduce((a, h) => a + h.seats, 0);
  return seats - booked - held;
}

/** The carrier's own later flights to the same destination, with free seats and the planned arrival delay. */
export async function alternatesFor(db: DataSource, original: FlightEntity) {
  const later = await db.getRepository(FlightEntity).find({
    where: { origin: original.origin, destination: original.destination, scheduledDeparture: MoreThan(original.scheduledDeparture) },
    order: { scheduledDeparture: 'ASC' },
    take: 6,
  });
  const rows = [];
  for (const f of later) {
    rows.push({ id: f.id, label: `${f.carrierCode} ${f.flightNumber}`, departure: f.scheduledDeparture.toISOString(), arrival: f.scheduledArrival.toISOString(), freeSeats: await freeSeats(db, f), plannedArrivalDelayMinutes: delayMinutes(original, f.scheduledArrival) });
  }
  return rows;
}

type RebookChoice = { alternateFlightId: number } | { manual: { carrier: string; number: string; departure: string; arrival: string } };

/**
 * Holds seats on the alternate for an accepted volunteer and queues the rebooking notice, in one transaction. The
 * alternate flight row is locked while its free seats are counted and the hold written, so two agents never sell the
 * same last seat. READ COMMITTED: the count after the lock sees the hold another agent committed just before; a
 * repeatable read would answer from the snapshot of this transaction's first read, taken before the lock.
 */
export async function rebookVolunteer(db: DataSource, user: SessionUser, volunteerId: number, choice: RebookChoice, enqueue: Enqueue = enqueueMessage) {
  return db.transaction('READ COMMITTED', async (em) => {
    const v = await em.findOne(VolunteerEntity, { where: { id: volunteerId }, lock: { mode: 'pessimistic_write' } });
    const round = v ? await em.findOneBy(VolunteerRoundEntity, { id: v.roundId }) : null;
    if (!v || !round || !canSeeStation(user, round.stationId)) throw notFound('Volunteer');
    if (v.status !== 'accepted') throw conflict('not_accepted', 'Only an accepted volunteer can be rebooked.');
    if (await em.findOneBy(RebookingEntity, { volunteerId })) throw conflict('already_rebooked', 'This volunteer already holds a seat on another flight.');
    const original = await em.findOneByOrFail(FlightEntity, { id: v.flightId });
    let hold: Partial<RebookingEntity>;
    let designator: { carrierCode: string; flightNumber: string };
    if ('alternateFlightId' in choice) {
      const alt = await em.findOne(FlightEntity, { where: { id: choice.alternateFlightId }, lock: { mode: 'pessimistic_write' } });
      if (!alt || alt.origin !== original.origin || alt.destination !== original.destination || alt.id === original.id) {
        throw badRequest('alternateFlightId: must be another flight on the same route', [{ field: 'alternateFlightId', rule: 'must be another flight on the same route' }]);
      }
      const free = await freeSeats(em, alt);
      if (free < v.passengerIds.length) throw conflict('no_seats', `${alt.carrierCode} ${alt.flightNumber} has ${Math.max(0, free)} free seat(s); this party needs ${v.passengerIds.length}.`);
      designator = { carrierCode: alt.carrierCode, flightNumber: alt.flightNumber };
      hold = { alternateFlightId: alt.id, label: `${alt.carrierCode} ${alt.flightNumber}`, departure: alt.scheduledDeparture, arrival: alt.scheduledArrival };
    } else {
      const departure = new Date(choice.manual.departure);
      const arrival = new Date(choice.manual.arrival);
      if (arrival <= departure) throw badRequest('manual.arrival: must be after the departure', [{ field: 'manual.arrival', rule: 'must be after the departure' }]);
      designator = { carrierCode: choice.manual.carrier, flightNumber: choice.manual.number };
      hold = { alternateFlightId: null, label: `${choice.manual.carrier} ${choice.manual.number}`, departure, arrival };
    }
    const row = await em.save(em.create(RebookingEntity, { ...hold, volunteerId, originalFlightId: original.id, plannedArrivalDelayMinutes: delayMinutes(original, hold.arrival!), seats: v.passengerIds.length, createdByUserId: user.id }));
    const notice = await enqueueRebookingNotice(em, round, v, { ...designator, departure: row.departure, arrival: row.arrival, plannedArrivalDelayMinutes: row.plannedArrivalDelayMinutes }, enqueue);
    // The alternate's consoles see its seats taken.
    recordEffect(em, flightChanged(round.flightId, round.stationId, ['rounds']), ...(row.alternateFlightId ? [flightChanged(row.alternateFlightId, round.stationId, ['counts'])] : []));
    await audit(em, { actor: user, action: 'volunteer.rebooked', entityType: 'volunteer', entityId: v.id, stationId: round.stationId, after: { label: row.label, departure: row.departure, arrival: row.arrival, plannedArrivalDelayMinutes: row.plannedArrivalDelayMinutes, seats: row.seats, notice } });
    return { round, volunteer: v, rebooking: row, original };
  });
}
