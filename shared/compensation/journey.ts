// What each rule measures on the passenger's whole journey, not just the leg at this station: where the distance ends,
// where the arrival delay is counted, and whether the trip is domestic (US) or intra-Community (EU/UK).
import { greatCircleKm } from './geodesic';
import type { Regime } from './types';
import { parseIsoDateTime } from './validation';

/** One flight of the ticket; times are instants with their offset. */
export interface JourneySegment {
  carrier: string;
  number: string;
  origin: string;
  destination: string;
  departure: string;
  arrival: string;
}

/** What the rules need to know of an airport; the server fills it from its airport dataset. */
export interface JourneyAirport {
  iata: string;
  country: string;
  lat: number;
  lon: number;
  /** In the territory where Reg. (EC) 261/2004 applies. */
  eu: boolean;
}

/** Looks an airport up; throws a RangeError naming `field` when it is not known. */
export type AirportResolver = (field: string, iata: string) => JourneyAirport;

/**
 * The US and the territories that 49 U.S.C. 40102(a) counts with the states for interstate air transportation
 * (Puerto Rico, the US Virgin Islands, Guam, American Samoa, the Northern Mariana Islands), spelled as the airport
 * dataset's country column spells them ("Virgin Islands" is the US group there; the British group is "British
 * Virgin Islands"). Checked against the dataset for SJU, STT, GUM, PPG and SPN.
 */
export const US_INTERSTATE_COUNTRIES: readonly string[] = ['United States', 'Puerto Rico', 'Virgin Islands', 'Guam', 'American Samoa', 'Northern Mariana Islands'];

/** 14 CFR 250.1: a stopover is a deliberate interruption of the journey scheduled to exceed 4 hours (the 4 h from memory). */
export const US_STOPOVER_MINUTES = 4 * 60;

/**
 * An alternate that reaches the connecting airport this long before the onward flight leaves keeps the passenger on it.
 * Common practice, no source: a station's minimum connection time differs by airport; the agent may always give the
 * planned arrival at the measured airport instead.
 */
export const KEEPS_CONNECTION_MINUTES = 60;

export interface JourneyScope {
  /** The denied flight's departure airport. */
  from: string;
  /** The last airport on the ticket. */
  finalDestination: string;
  /** Where this rule counts the arrival delay. */
  measuredTo: string;
  /** The scheduled arrival there on the original journey. */
  scheduledArrival: string;
  /** Why the delay is counted at `measuredTo`, with the rule. */
  measuredBecause: string;
  /** eu-261 / uk-261: great-circle distance from `from` to the final destination. */
  distanceKm?: number;
  /** eu-261: both ends in the EU; uk-261: both ends in the UK. */
  intraCommunity?: boolean;
  /** us-dot: foreign air transportation to `measuredTo` (a territory counts as interstate). */
  international?: boolean;
  /** The denied flight and the onward flights up to the final destination, in order. */
  segments: JourneySegment[];
}

export const isUsInterstate = (country: string) => US_INTERSTATE_COUNTRIES.includes(country);

/** Checks that the onward flights join up: each leaves from where the last arrived, after it arrived. */
export function checkItinerary(denied: JourneySegment, onward: readonly JourneySegment[]): void {
  let previous = denied;
  onward.forEach((segment, i) => {
    const field = `itinerary[${i}]`;
    if (segment.origin !== previous.destination) {
      throw new RangeError(`${field}.origin: must be ${previous.destination}, where the flight before it arrives (got ${segment.origin})`);
    }
    const departs = parseIsoDateTime(`${field}.departure`, segment.departure);
    const arrives = parseIsoDateTime(`${field}.arrival`, segment.arrival);
    if (arrives <= departs) throw new RangeError(`${field}.arrival: must be after its departure`);
    if (departs < parseIsoDateTime('arrival', previous.arrival)) {
      throw new RangeError(`${field}.departure: must be after the flight before it arrives at ${segment.origin}`);
    }
    previous = segment;
  });
}

const minutesBetween = (fromIso: string, toIso: string) => Math.round((Date.parse(toIso) - Date.parse(fromIso)) / 60_000);

export function journeyScope(regime: Regime, denied: JourneySegment, onward: readonly JourneySegment[], airport: AirportResolver): JourneyScope {
  checkItinerary(denied, onward);
  const segments = [denied, ...onward];
  const last = segments[segments.length - 1];
  const from = airport('origin', denied.origin);
  const final = airport('finalDestination', last.destination);
  // Every airport on the ticket must be known, whichever one the rule ends up measuring to.
  onward.forEach((s, i) => airport(`itinerary[${i}].destination`, s.destination));
  const base = { from: from.iata, finalDestination: final.iata, segments };

  if (regime === 'us-dot') {
    let measured = last;
    let because = `the destination on the ticket, with no stopover on the way (14 CFR 250.5(a)-(b); stopover as defined in 14 CFR 250.1)`;
    for (let i = 0; i < segments.length - 1; i++) {
      const ground = minutesBetween(segments[i].arrival, segments[i + 1].departure);
      if (ground > US_STOPOVER_MINUTES) {
        measured = segments[i];
        because = `the first stopover: ${Math.floor(ground / 60)} h on the ground before the onward flight, more than 4 h (14 CFR 250.1, 250.5)`;
        break;
      }
    }
    if (segments.length === 1) because = 'the destination of the flight, the last on the ticket (14 CFR 250.5)';
    const to = airport('measuredTo', measured.destination);
    const international = !(isUsInterstate(from.country) && isUsInterstate(to.country));
    return { ...base, measuredTo: to.iata, scheduledArrival: measured.arrival, measuredBecause: because, international };
  }

  const measuredBecause = regime === 'ca-appr'
    ? 'the destination on the ticket (SOR/2019-150 s. 20(1): the delay of arrival at the destination indicated on the ticket)'
    : 'the final destination, the last on the ticket (Reg. 261/2004 Art. 2(h), 7(1); CJEU C-559/16 Bossen)';
  const scope: JourneyScope = { ...base, measuredTo: final.iata, scheduledArrival: last.arrival, measuredBecause };
  if (regime === 'eu-261' || regime === 'uk-261') {
    scope.distanceKm = greatCircleKm(from, final);
    scope.intraCommunity = regime === 'eu-261' ? from.eu && final.eu : from.country === 'United Kingdom' && final.country === 'United Kingdom';
  }
  return scope;
}

/**
 * The planned arrival delay at the measured airport, in whole minutes (never below 0); null when no alternate was
 * offered. `alternateArrival` is the alternate's arrival at the denied flight's destination; `arrivalAtMeasured`, when
 * given, is the planned arrival at the measured airport itself (a rerouting that no longer follows the onward flights).
 */
export function plannedDelayAtMeasured(scope: JourneyScope, alternateArrival: string | null, arrivalAtMeasured?: string | null): number | null {
  if (alternateArrival === null) return null;
  parseIsoDateTime('alternate arrival', alternateArrival);
  const denied = scope.segments[0];
  if (arrivalAtMeasured) {
    parseIsoDateTime('arrivalAtDestination', arrivalAtMeasured);
    return Math.max(0, minutesBetween(scope.scheduledArrival, arrivalAtMeasured));
  }
  if (scope.measuredTo === denied.destination && scope.segments.length === 1) {
    return Math.max(0, minutesBetween(denied.arrival, alternateArrival));
  }
  const measuredIndex = scope.segments.findIndex((s) => s.destination === scope.measuredTo && s.arrival === scope.scheduledArrival);
  if (measuredIndex === 0) return Math.max(0, minutesBetween(denied.arrival, alternateArrival));
  const onward = scope.segments[1];
  if (minutesBetween(alternateArrival, onward.departure) >= KEEPS_CONNECTION_MINUTES) return 0;
  throw new RangeError(
    `arrivalAtDestination: required: the alternate reaches ${denied.destination} too late for the onward ${onward.carrier} ${onward.number}; give the planned arrival at ${scope.measuredTo}`,
  );
}
