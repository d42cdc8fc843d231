// After authorization: the seat on an alternate (or the record that none was offered), then in the same
// transaction what each passenger is owed, the report line, and the written statements in the outbox.
import { In, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { DenialCompensationSnapshot, RebookDenialBody } from '@shared/schemas/denials';
import type { RegimeCode } from '@shared/schemas/common';
import { BookingEntity, DenialEntity, FlightEntity, PassengerEntity, RebookingEntity, StationEntity } from '../../db/entities';
import { badRequest, conflict, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { rebookingNotice } from '../../notices';
import { formatDuration } from '../../notices/format';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { recordCompensationDue } from '../compensations/compensation-due';
import { enqueueMessage } from '../outbox/outbox.service';
import { denialCategory } from './category';
import { checkExemption, journeyOf, measuredWords, passengerCompensation, plannedDelayOnJourney, type CaseFacts } from './compensation';
import { enforcementBodyFor } from './enforcement-bodies';
import { priorityRulesFor } from './priority-rules.service';
import { denialDate } from './recorded.service';
import { statementFor, statementMail } from './statement';
import { choiceAndCareForStatement } from '../care/for-statement';
import { freeSeats } from '../volunteers/rebooking.service';

/** The delay is counted where the station's rule measures it on the booking's journey, not at the end of this leg. */
type DelayOf = (arrival: Date) => number;

async function holdSeats(em: EntityManager, user: SessionUser, denial: DenialEntity, original: FlightEntity, body: RebookDenialBody, delayOf: DelayOf): Promise<RebookingEntity | null> {
  if (body.noAlternate) return null;
  let hold: Pick<RebookingEntity, 'alternateFlightId' | 'label' | 'departure' | 'arrival'>;
  if (body.alternateFlightId !== undefined) {
    const alt = await em.findOne(FlightEntity, { where: { id: body.alternateFlightId }, lock: { mode: 'pessimistic_write' } });
    if (!alt || alt.id === original.id || alt.origin !== original.origin || alt.destination !== original.destination) {
      throw badRequest('alternateFlightId: must be another flight on the same route', [{ field: 'alternateFlightId', rule: 'must be another flight on the same route' }]);
    }
    const free = await freeSeats(em, alt);
    if (free < denial.passengerIds.length) {
      throw conflict('no_seats', `${alt.carrierCode} ${alt.flightNumber} has ${Math.max(0, free)} free seat(s); this party needs ${denial.passengerIds.length}.`);
    }
    hold = { alternateFlightId: alt.id, label: `${alt.carrierCode} ${alt.flightNumber}`, departure: alt.scheduledDeparture, arrival: alt.scheduledArrival };
  } else {
    const manual = body.manual!;
    const departure = new Date(manual.departure);
    const arrival = new Date(manual.arrival);
    if (arrival <= departure) throw badRequest('manual.arrival: must be after the departure', [{ field: 'manual.arrival', rule: 'must be after the departure' }]);
    hold = { alternateFlightId: null, label: `${manual.carrier} ${manual.number}`, departure, arrival };
  }
  return em.save(em.create(RebookingEntity, {
    ...hold, volunteerId: null, denialId: denial.id, originalFlightId: original.id,
    plannedArrivalDelayMinutes: delayOf(hold.arrival), seats: denial.passengerIds.length, createdByUserId: user.id,
  }));
}

function basisText(rebooking: RebookingEntity | null, exemption: string | undefined, measured: string): string {
  const base = rebooking
    ? `Rebooked on ${rebooking.label}, planned to arrive ${formatDuration(rebooking.plannedArrivalDelayMinutes)} after the original schedule, ${measured}`
    : 'No alternate transportation offered';
  return exemption ? `${base}; exemption ${exemption} applied` : base;
}

/**
 * READ COMMITTED, as for volunteers: the free-seat count taken after the alternate's row lock must see a hold another
 * agent committed just before, not this transaction's earlier snapshot.
 */
export async function rebookDenial(db: DataSource, user: SessionUser, denialId: number, body: RebookDenialBody) {
  return db.transaction('READ COMMITTED', async (em) => {
    const denial = await em.findOne(DenialEntity, { where: { id: denialId }, lock: { mode: 'pessimistic_write' } });
    if (!denial || !canSeeStation(user, denial.stationId)) throw notFound('Denial');
    if (denial.status !== 'authorized') throw conflict('not_authorized', 'Only an authorized denial can be rebooked; a supervisor authorizes it first.');
    if (denial.compensation) throw conflict('already_rebooked', 'This denial is already rebooked and its compensation fixed.');
    const [original, station, booking, passengers] = await Promise.all([
      em.findOneByOrFail(FlightEntity, { id: denial.flightId }),
      em.findOneByOrFail(StationEntity, { id: denial.stationId }),
      em.findOneByOrFail(BookingEntity, { id: denial.bookingId }),
      em.findBy(PassengerEntity, { id: In(denial.passengerIds) }),
    ]);
    const regime = station.regime as RegimeCode;
    checkExemption(regime, body.exemption);
    const delayOf: DelayOf = (arrival) => plannedDelayOnJourney(station, original, booking, arrival, body.arrivalAtDestination) ?? 0;
    const rebooking = await holdSeats(em, user, denial, original, body, delayOf);
    const onBoard = await em.find(PassengerEntity, { where: { flightId: original.id }, select: { cabin: true, fareMinor: true, fareCurrency: true, fareType: true } });
    const facts: CaseFacts = {
      station, flight: original, deniedOn: denialDate(denial, original, station), booking, onBoard, plannedArrivalDelayMinutes: rebooking?.plannedArrivalDelayMinutes ?? null,
      exemption: body.exemption, applyReroutingReduction: body.applyReroutingReduction,
    };
    const owed = passengers.map((p) => passengerCompensation(facts, p));
    const problem = owed.find((c) => c.problem !== null);
    if (problem) {
      const field = problem.problem!.split(':')[0];
      throw badRequest(`${problem.name}: ${problem.problem}`, [{ field, rule: problem.problem! }]);
    }
    for (const c of owed) {
      await recordCompensationDue(em, {
        stationId: station.id, flightId: original.id, bookingId: booking.id, passengerId: c.passengerId, sourceKind: 'denial', sourceId: denial.id,
        regime, voluntary: false, amountMinor: c.amountMinor, currency: c.currency, band: c.band, ruleRef: c.ruleRef, explanation: c.explanation,
      });
    }
    const category = denialCategory({ bands: owed.map((c) => c.band), exemption: body.exemption, hasAlternate: rebooking !== null });
    const enforcement = enforcementBodyFor(regime, original.origin);
    const { rules } = await priorityRulesFor(em, station.id);
    const snapshot: DenialCompensationSnapshot = {
      plannedArrivalDelayMinutes: facts.plannedArrivalDelayMinutes, basis: basisText(rebooking, body.exemption, measuredWords(journeyOf(station, original, booking))), passengers: owed,
      reviewFlags: [enforcement.reviewFlag], priorityRules: rules,
    };
    const messageIds = await queueStatements(em, { denial, station, original, booking, passengers, snapshot, rebooking });
    Object.assign(denial, { compensation: snapshot, category, statementMessageIds: messageIds });
    await em.save(denial);

    const stationId = station.id;
    await audit(em, {
      actor: user, action: 'denial.rebooked', entityType: 'denial', entityId: denial.id, stationId,
      after: rebooking
        ? { label: rebooking.label, alternateFlightId: rebooking.alternateFlightId, departure: rebooking.departure, arrival: rebooking.arrival, plannedArrivalDelayMinutes: rebooking.plannedArrivalDelayMinutes }
        : { noAlternate: true },
    });
    await audit(em, {
      actor: user, action: 'denial.compensation_fixed', entityType: 'denial', entityId: denial.id, stationId,
      after: { category, exemption: body.exemption ?? null, passengers: owed.map((c) => ({ passengerId: c.passengerId, amountMinor: c.amountMinor, currency: c.currency, band: c.band, ruleRef: c.ruleRef })) },
    });
    await audit(em, {
      actor: user, action: 'denial.statements_queued', entityType: 'denial', entityId: denial.id, stationId,
      after: { to: booking.contactEmail, messageIds, passengersWithoutAddress: booking.contactEmail ? [] : denial.passengerIds },
    });
    // The alternate's consoles see its seats taken.
    recordEffect(em, flightChanged(original.id, original.stationId, ['denials', 'compensations']), ...(rebooking?.alternateFlightId ? [flightChanged(rebooking.alternateFlightId, original.stationId, ['counts'])] : []));
    return { denial, flight: original, rebooking };
  });
}

interface StatementJob {
  denial: DenialEntity;
  station: StationEntity;
  original: FlightEntity;
  booking: BookingEntity;
  passengers: PassengerEntity[];
  snapshot: DenialCompensationSnapshot;
  rebooking: RebookingEntity | null;
}

/** One statement per passenger to the booking's contact address; none when the booking has no address (print it). */
async function queueStatements(em: EntityManager, job: StatementJob): Promise<string[]> {
  const to = job.booking.contactEmail;
  if (!to) return [];
  const rules = job.snapshot.priorityRules ?? [];
  const ids: string[] = [];
  for (const passenger of job.passengers) {
    const compensation = job.snapshot.passengers.find((c) => c.passengerId === passenger.id)!;
    // A passenger rebooked a second time may already have a recorded choice and care: the statement carries them.
    const choiceAndCare = await choiceAndCareForStatement(em, { sourceKind: 'denial', sourceId: job.denial.id, passengerId: passenger.id }, job.booking.language ?? 'en');
    const mail = statementMail(statementFor({ station: job.station, flight: job.original, pnr: job.booking.pnr, passenger, compensation, rebooking: job.rebooking, rules, language: job.booking.language, choiceAndCare }));
    const queued = await enqueueMessage(em, {
      stationId: job.station.id, flightId: job.original.id, passengerIds: [passenger.id], kind: 'written-statement', to, ...mail,
      dedupeKey: `denial-statement:${job.denial.id}:${passenger.id}`,
    });
    ids.push(queued.id);
  }
  if (job.rebooking) {
    const notice = rebookingNotice({
      station: job.station, pnr: job.booking.pnr, passengerNames: job.passengers.map((p) => `${p.firstName} ${p.lastName}`), reason: 'denied-boarding', language: job.booking.language ?? undefined,
      originalFlight: job.original,
      newFlight: { carrierCode: job.rebooking.label.split(' ')[0], flightNumber: job.rebooking.label.split(' ')[1] ?? '', origin: job.original.origin, destination: job.original.destination, departure: job.rebooking.departure, arrival: job.rebooking.arrival },
    });
    await enqueueMessage(em, {
      stationId: job.station.id, flightId: job.original.id, passengerIds: job.denial.passengerIds, kind: 'rebooking-notice', to, ...notice,
      dedupeKey: `denial-rebooking:${job.denial.id}`,
    });
  }
  return ids;
}
