// What each denied passenger is owed under the station's regime, from the facts of the flight and the rebooking.
import { compensationDue, EXEMPTIONS, type CompensationInput, type CompensationResult } from '@shared/compensation';
import type { PassengerCompensation } from '@shared/schemas/denials';
import type { RegimeCode } from '@shared/schemas/common';
import type { FlightEntity, PassengerEntity, StationEntity } from '../../db/entities';
import { badRequest } from '../../http/errors';
import { findAirport, isEuAirport, routeDistanceKm } from '../../reference/airports';
import { seatsOf } from './candidates.service';

export interface CaseFacts {
  station: StationEntity;
  flight: FlightEntity;
  /** The station-local date the denial happened; the amounts in force that day apply. Default: the flight's date. */
  deniedOn?: string;
  /** Planned arrival of the alternate vs the original; null when no alternate transportation was offered. */
  plannedArrivalDelayMinutes: number | null;
  exemption?: string;
  applyReroutingReduction?: boolean;
}

const REGIME_CURRENCY: Record<RegimeCode, string> = { 'us-dot': 'USD', 'eu-261': 'EUR', 'uk-261': 'GBP', 'ca-appr': 'CAD' };

const countryOf = (iata: string) => findAirport(iata)?.country ?? null;

export function checkExemption(regime: RegimeCode, exemption: string | undefined): void {
  if (exemption === undefined) return;
  const codes = EXEMPTIONS[regime].map((e) => e.code);
  if (!codes.includes(exemption)) {
    throw badRequest(`exemption: ${exemption} is not an exemption of ${regime}; use one of ${codes.join(', ')}`, [{ field: 'exemption', rule: `must be one of ${codes.join(', ')}` }]);
  }
}

function inputFor(facts: CaseFacts, passenger: PassengerEntity): CompensationInput {
  const regime = facts.station.regime as RegimeCode;
  const { origin, destination } = facts.flight;
  const input: CompensationInput = {
    regime,
    deniedOn: facts.deniedOn ?? facts.flight.serviceDate,
    voluntary: false,
    plannedArrivalDelayMinutes: facts.plannedArrivalDelayMinutes,
    ...(facts.exemption !== undefined ? { exemption: facts.exemption } : {}),
  };
  if (regime === 'us-dot') {
    // Foreign air transportation: from a US airport to one abroad (14 CFR 250.5(b)).
    const international = countryOf(destination) !== 'United States';
    return { ...input, oneWayFare: { amountMinor: passenger.fareMinor, currency: passenger.fareCurrency }, international, aircraftSeats: seatsOf(facts.flight) };
  }
  if (regime === 'eu-261' || regime === 'uk-261') {
    const intraCommunity = regime === 'eu-261'
      ? isEuAirport(origin) && isEuAirport(destination)
      : countryOf(origin) === 'United Kingdom' && countryOf(destination) === 'United Kingdom';
    return { ...input, distanceKm: routeDistanceKm(origin, destination), intraCommunity, applyReroutingReduction: facts.applyReroutingReduction ?? false };
  }
  return input;
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
