// What each denied passenger is owed under the station's regime, from the facts of the flight and the rebooking.
import {
  compensationDue, EXEMPTIONS, journeyScope, lowestCashFare, plannedDelayAtMeasured, ticketKindOf, isZeroFareTicket,
  type CompensationInput, type CompensationResult, type FareOnBoard, type JourneyScope,
} from '@shared/compensation';
import type { PassengerCompensation } from '@shared/schemas/denials';
import type { RegimeCode } from '@shared/schemas/common';
import type { BookingEntity, FlightEntity, PassengerEntity, StationEntity } from '../../db/entities';
import { badRequest } from '../../domain/errors';
import { flightSegment, journeyAirport } from '../../reference/journey-airports';
import { seatsOf } from './candidates.service';

export interface CaseFacts {
  station: StationEntity;
  flight: FlightEntity;
  /** The station-local date the denial happened; the amounts in force that day apply. Default: the flight's date. */
  deniedOn?: string;
  /** Planned arrival of the alternate vs the original; null when no alternate transportation was offered. */
  plannedArrivalDelayMinutes: number | null;
  /** The denied booking: its onward flights decide where each rule measures distance and delay. */
  booking?: Pick<BookingEntity, 'itinerary'> | null;
  /** Fares on the flight: a zero-fare ticket is priced at the lowest cash fare in its cabin (14 CFR 250.5(d)). */
  onBoard?: readonly FareOnBoard[];
  exemption?: string;
  applyReroutingReduction?: boolean;
}

const REGIME_CURRENCY: Record<RegimeCode, string> = { 'us-dot': 'USD', 'eu-261': 'EUR', 'uk-261': 'GBP', 'ca-appr': 'CAD' };

/** What the station's rule measures on this booking's journey; throws a RangeError naming the field at fault. */
export function journeyOf(station: StationEntity, flight: FlightEntity, booking: Pick<BookingEntity, 'itinerary'> | null | undefined): JourneyScope {
  return journeyScope(station.regime as RegimeCode, flightSegment(flight), booking?.itinerary ?? [], journeyAirport);
}

/**
 * The planned arrival delay where the rule measures it (the final destination, or the US first stopover), from the
 * alternate's arrival at this flight's destination or the planned arrival there given by the agent. A refusal names the field.
 */
export function plannedDelayOnJourney(station: StationEntity, flight: FlightEntity, booking: Pick<BookingEntity, 'itinerary'> | null, alternateArrival: Date | null, arrivalAtDestination?: string): number | null {
  try {
    return plannedDelayAtMeasured(journeyOf(station, flight, booking), alternateArrival?.toISOString() ?? null, arrivalAtDestination);
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    const field = err.message.split(':')[0];
    throw badRequest(err.message, [{ field, rule: err.message.slice(field.length + 1).trim() }]);
  }
}

export function checkExemption(regime: RegimeCode, exemption: string | undefined): void {
  if (exemption === undefined) return;
  const codes = EXEMPTIONS[regime].map((e) => e.code);
  if (!codes.includes(exemption)) {
    throw badRequest(`exemption: ${exemption} is not an exemption of ${regime}; use one of ${codes.join(', ')}`, [{ field: 'exemption', rule: `must be one of ${codes.join(', ')}` }]);
  }
}

function inputFor(facts: CaseFacts, passenger: PassengerEntity): CompensationInput {
  const regime = facts.station.regime as RegimeCode;
  const scope = journeyOf(facts.station, facts.flight, facts.booking);
  const ticket = ticketKindOf(passenger.fareType);
  const input: CompensationInput = {
    regime,
    deniedOn: facts.deniedOn ?? facts.flight.serviceDate,
    voluntary: false,
    plannedArrivalDelayMinutes: facts.plannedArrivalDelayMinutes,
    ticket,
    ...(facts.exemption !== undefined ? { exemption: facts.exemption } : {}),
  };
  if (regime === 'us-dot') {
    const lowest = isZeroFareTicket(ticket, passenger.fareMinor) ? lowestCashFare(facts.onBoard ?? [], passenger.cabin, passenger.fareCurrency) : null;
    return {
      ...input, oneWayFare: { amountMinor: passenger.fareMinor, currency: passenger.fareCurrency }, international: scope.international, aircraftSeats: seatsOf(facts.flight),
      ...(lowest !== null ? { lowestCashFareSameClass: { amountMinor: lowest, currency: passenger.fareCurrency } } : {}),
    };
  }
  if (regime === 'eu-261' || regime === 'uk-261') {
    return { ...input, distanceKm: scope.distanceKm, intraCommunity: scope.intraCommunity, applyReroutingReduction: facts.applyReroutingReduction ?? false };
  }
  return input;
}

/** Where the amounts were measured, for the basis shown beside them. */
export function measuredWords(scope: JourneyScope): string {
  const via = scope.segments.length > 1 ? ` (journey ${[scope.from, ...scope.segments.map((s) => s.destination)].join('-')})` : '';
  return `measured to ${scope.measuredTo}${via}: ${scope.measuredBecause}`;
}

/** Never throws for a passenger's data: a rule that cannot be applied comes back as a problem to show and fix. */
export function passengerCompensation(facts: CaseFacts, passenger: PassengerEntity): PassengerCompensation {
  const name = `${passenger.firstName} ${passenger.lastName}`;
  let result: CompensationResult;
  try {
    result = compensationDue(inputFor(facts, passenger));
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    return {
      passengerId: passenger.id, name, amountMinor: 0, currency: REGIME_CURRENCY[facts.station.regime as RegimeCode], band: 'not-computed', ruleRef: '',
      explanation: `Could not be computed: ${err.message}`, notes: [], reviewFlags: [`Fix the passenger's data, then compute again: ${err.message}`],
      problem: err.message, rulesInForce: null,
    };
  }
  return {
    passengerId: passenger.id, name, amountMinor: result.amountMinor, currency: result.currency, band: result.band, ruleRef: result.ruleRef,
    explanation: result.explanation, notes: result.notes, reviewFlags: result.reviewFlags, problem: null, rulesInForce: result.rulesInForce,
  };
}

/** The stored figures back in the shape the written statement takes. */
export function asCompensationResult(c: PassengerCompensation): CompensationResult {
  if (!c.rulesInForce) throw new RangeError(`compensation for ${c.name}: not computed (${c.problem ?? 'no rules in force'})`);
  return { amountMinor: c.amountMinor, currency: c.currency, band: c.band, ruleRef: c.ruleRef, explanation: c.explanation, notes: c.notes, reviewFlags: c.reviewFlags, rulesInForce: c.rulesInForce };
}
