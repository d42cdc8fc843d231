// A supervisor's correction: a denial that happened but was not recorded at the time (the flight may have left).
// It is recorded with its real date and time and a reason, authorized by that supervisor in the same act, and audited;
// from then on it is paid and reported like any other denial, with the amounts in force on the day it happened.
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { RecordDenialAfterBody } from '@shared/schemas/denials';
import { DenialEntity, DenialProposalEntity, FlightEntity, PassengerEntity, StationEntity, VolunteerEntity } from '../../db/entities';
import { badRequest, forbidden } from '../../domain/errors';
import { flightMoved, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { In } from 'typeorm';
import { passengersOfOneBooking } from './refusals.service';
import { checkInDeadline, checkInTime } from './shortfall';

const HOUR = 3_600_000;

/** The calendar date of an instant at the station: the day whose amounts apply. */
export function stationDate(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}

/** The date a denial happened, in the station's zone: the recorded time for a correction, else the flight's day. */
export function denialDate(denial: Pick<DenialEntity, 'occurredAt'>, flight: FlightEntity, station: StationEntity): string {
  return denial.occurredAt ? stationDate(denial.occurredAt, station.timeZone) : flight.serviceDate;
}

function field(message: string, rule: string, name = 'occurredAt') {
  return badRequest(`${name}: ${message}`, [{ field: name, rule }]);
}

export async function recordDenialAfter(db: DataSource, user: SessionUser, flightId: number, body: RecordDenialAfterBody) {
  if (user.role !== 'supervisor') throw forbidden('Recording a denial after the fact is a supervisor\'s correction.');
  return db.transaction(async (em) => {
    const flight = await em.findOneOrFail(FlightEntity, { where: { id: flightId }, lock: { mode: 'pessimistic_write' } });
    const occurredAt = new Date(body.occurredAt);
    const now = new Date();
    if (occurredAt.getTime() > now.getTime() + 60_000) throw field('cannot be in the future: record what already happened', 'must not be later than now');
    const from = flight.scheduledDeparture.getTime() - 24 * HOUR;
    const to = flight.scheduledDeparture.getTime() + 12 * HOUR;
    if (occurredAt.getTime() < from || occurredAt.getTime() > to) {
      throw field('must fall on the day of this flight (from 24 h before to 12 h after its scheduled departure)', 'must be within 24 h before to 12 h after the scheduled departure');
    }
    const passengers = await passengersOfOneBooking(em, flight, body.passengerIds);
    const deadline = await checkInDeadline(em, flight);
    const refused = (why: string, p: PassengerEntity) => badRequest(`passengerIds: ${p.firstName} ${p.lastName} ${why}`, [{ field: 'passengerIds', rule: 'must name passengers who presented on time and did not travel' }]);
    const volunteers = new Set((await em.findBy(VolunteerEntity, { flightId, status: 'accepted' })).flatMap((v) => v.passengerIds));
    for (const p of passengers) {
      if (p.status === 'boarded') throw refused('boarded this flight: not denied', p);
      if (volunteers.has(p.id)) throw refused('gave up the seat as a volunteer: not an involuntary denial', p);
      const at = checkInTime(p);
      if (at === null) throw refused('never checked in: a no-show, not a denied passenger', p);
      if (at.getTime() > deadline.getTime()) throw refused('checked in after the deadline: did not present on time', p);
    }
    const station = await em.findOneByOrFail(StationEntity, { id: flight.stationId });
    const reason = `Recorded after the fact: ${body.reason}`.slice(0, 300);
    const proposal = await em.save(em.create(DenialProposalEntity, {
      flightId, stationId: flight.stationId, status: 'authorized', seatsNeeded: passengers.length, proposedByUserId: user.id, proposedByLabel: user.displayName,
      decidedByUserId: user.id, decidedAt: now, reason,
    }));
    const denial = await em.save(em.create(DenialEntity, {
      proposalId: proposal.id, flightId, stationId: flight.stationId, bookingId: passengers[0].bookingId, passengerIds: passengers.map((p) => p.id), position: 0,
      reasons: [`recorded after the fact by ${user.displayName}: ${body.reason}`, `happened ${body.occurredAt}; amounts in force on ${stationDate(occurredAt, station.timeZone)} apply`],
      status: 'authorized', selectedByUserId: user.id, authorizedByUserId: user.id, authorizedAt: occurredAt, changeReason: null, category: null,
      compensation: null, statementMessageIds: null, occurredAt,
    }));
    await em.update(PassengerEntity, { id: In(denial.passengerIds), flightId }, { status: 'offloaded', statusChangedAt: now });
    await audit(em, {
      actor: user, action: 'denial.recorded_after_fact', entityType: 'denial', entityId: denial.id, stationId: flight.stationId,
      before: { statuses: passengers.map((p) => ({ passengerId: p.id, status: p.status })) },
      after: { proposalId: proposal.id, flightId, passengerIds: denial.passengerIds, occurredAt: occurredAt.toISOString(), deniedOn: stationDate(occurredAt, station.timeZone), reason: body.reason },
    });
    recordEffect(em, ...flightMoved(flight.id, flight.stationId, ['denials', 'counts', 'forecast']));
    return { denial, proposal, flight };
  });
}
