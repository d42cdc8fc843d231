// Learns each station's and route's show-up profile from closed flights. Pure: rows in, model out.
import {
  CHECK_IN_GRID, estimateCommonShock, learnCheckInCurve, learnShowRates, lookupRate, type LearnedRate,
} from '@shared/forecast';
import { learnSegmentRates, segmentRatesOf, stationSegments, type SegmentRow } from './segments';
import { SHOWED_OUTCOMES, type BookingOutcomeValue } from '@shared/schemas/learning';
import { showUpProfileSchema, type ShowUpProfile } from '@shared/schemas/show-up-profile';

export interface TrainingOutcome {
  cabin: string;
  fareClass: string;
  connecting: boolean;
  /** Where the booking was made, or 'unknown'. */
  channel: string;
  checkedInAt: Date | null;
  checkedInT3: boolean;
  outcome: BookingOutcomeValue;
}

export interface TrainingFlight {
  id: number;
  stationId: number;
  destination: string;
  scheduledDeparture: Date;
  seatsByCabin: Record<string, number>;
  outcomes: TrainingOutcome[];
}

export interface StationModel {
  profile: ShowUpProfile;
  routes: Record<string, ShowUpProfile>;
  /** Intra-class correlation of the learned day-to-day common shock; null when the flights spread no more than chance. */
  shockRho: number | null;
  /** The station's rate per check-in segment and channel, with its evidence, for the calibration screen. */
  segments?: SegmentRow[];
}

export interface RatesModel {
  stations: Record<string, StationModel>;
}

const showed = (o: TrainingOutcome) => SHOWED_OUTCOMES.has(o.outcome);
const connection = (o: TrainingOutcome) => (o.connecting ? 'connecting' : 'local');
/** Fares other than flexible ones are learned together: the profile scales flexible fares by one factor. */
const fareGroup = (o: TrainingOutcome) => (o.fareClass === 'flex' ? 'flex' : 'standard');

/** Share of flights held out of training for the calibration: the latest fifth (our own choice). */
export const HELD_OUT_SHARE = 0.2;

/** The latest fifth of the flights by departure, at least one once there are five. */
export function splitHeldOut<T extends { scheduledDeparture: Date; id: number }>(flights: T[]): { training: T[]; heldOut: T[] } {
  const sorted = [...flights].sort((a, b) => a.scheduledDeparture.getTime() - b.scheduledDeparture.getTime() || a.id - b.id);
  const held = flights.length >= 5 ? Math.max(1, Math.round(flights.length * HELD_OUT_SHARE)) : 0;
  return { training: sorted.slice(0, sorted.length - held), heldOut: sorted.slice(sorted.length - held) };
}

function count<K>(rows: Iterable<[K, boolean]>): Map<K, { booked: number; showed: number }> {
  const out = new Map<K, { booked: number; showed: number }>();
  for (const [key, hit] of rows) {
    const c = out.get(key) ?? { booked: 0, showed: 0 };
    c.booked += 1;
    if (hit) c.showed += 1;
    out.set(key, c);
  }
  return out;
}

const bookingSegment = (f: TrainingFlight, o: TrainingOutcome) => [String(f.stationId), f.destination, connection(o), o.cabin, fareGroup(o)];

/** Booking-level show rates per station / route / connection / cabin / fare group. */
export function learnBookingRates(flights: TrainingFlight[]): Map<string, LearnedRate> {
  const counts = count(flights.flatMap((f) => f.outcomes.map((o): [string, boolean] => [bookingSegment(f, o).join('/'), showed(o)])));
  return learnShowRates([...counts].map(([key, c]) => ({ segment: key.split('/'), ...c })));
}

function routeProfile(rates: Map<string, LearnedRate>, station: string, route: string, cabins: string[], base: Omit<ShowUpProfile, 'bookingRates'>, segmentRates: Record<string, number>): ShowUpProfile {
  const rate = (conn: string, cabin: string) => lookupRate(rates, [station, route, conn, cabin, 'standard'])?.rate ?? 0.9;
  const bookingRates = {
    local: Object.fromEntries(cabins.map((c) => [c, rate('local', c)])),
    connecting: Object.fromEntries(cabins.map((c) => [c, rate('connecting', c)])),
  };
  // Missed connections count as not shown in the history: the rates hold the usual share of them already.
  return showUpProfileSchema.parse({ ...base, bookingRates, segmentRates, ratesIncludeUsualConnection: true });
}

/** The check-in curve of a profile: the learned shares on the grid, closing at 1 when check-in closes. */
function curveOf(points: Array<[number, number]>, closeMinutes: number): Array<[number, number]> {
  const kept = points.filter(([m]) => m > closeMinutes);
  return [...kept, [closeMinutes, 1]];
}

/**
 * Learns the model from the training flights. `handSet` gives each station's hand-set profile, from which the parts
 * not learned here (check-in close, minimum connecting time) are kept.
 */
export function learnModel(flights: TrainingFlight[], handSet: (stationId: number) => ShowUpProfile): RatesModel {
  const rates = learnBookingRates(flights);
  const segmentRates = learnSegmentRates(flights);
  const checkedIn = count(flights.flatMap((f) => f.outcomes.filter((o) => o.checkedInAt).map((o): [string, boolean] => [String(f.stationId), showed(o)])));
  const checkedInRates = learnShowRates([...checkedIn].map(([s, c]) => ({ segment: [s], ...c })));
  const curveRows = new Map<string, { showed: number; checkedInBy: number[] }>();
  for (const f of flights) {
    const key = `${f.stationId}/${f.destination}`;
    const row = curveRows.get(key) ?? { showed: 0, checkedInBy: CHECK_IN_GRID.map(() => 0) };
    for (const o of f.outcomes) {
      if (!showed(o)) continue;
      row.showed += 1;
      CHECK_IN_GRID.forEach((m, k) => {
        if (o.checkedInAt && o.checkedInAt.getTime() <= f.scheduledDeparture.getTime() - m * 60_000) row.checkedInBy[k] += 1;
      });
    }
    curveRows.set(key, row);
  }
  const curves = learnCheckInCurve([...curveRows].map(([key, r]) => ({ segment: key.split('/'), ...r })));

  const stations: Record<string, StationModel> = {};
  for (const stationId of new Set(flights.map((f) => f.stationId))) {
    const station = String(stationId);
    const mine = flights.filter((f) => f.stationId === stationId);
    const hand = handSet(stationId);
    const cabins = [...new Set(mine.flatMap((f) => Object.keys(f.seatsByCabin)))].sort();
    const pooled = (group: string) => {
      const rows = mine.flatMap((f) => f.outcomes.filter((o) => fareGroup(o) === group));
      return rows.length ? rows.filter(showed).length / rows.length : null;
    };
    const [flex, standard] = [pooled('flex'), pooled('standard')];
    const flexibleFareFactor = flex !== null && standard ? Math.min(1.2, Math.max(0.5, flex / standard)) : hand.flexibleFareFactor;
    const base = (curveKey: string) => ({
      flexibleFareFactor,
      checkedInShowRate: checkedInRates.get(station)?.rate ?? hand.checkedInShowRate,
      checkInCurve: curves.get(curveKey) ? curveOf(curves.get(curveKey)!, hand.checkInCloseMinutes) : hand.checkInCurve,
      checkInCloseMinutes: hand.checkInCloseMinutes,
      minimumConnectMinutes: hand.minimumConnectMinutes,
    });
    const routes = Object.fromEntries([...new Set(mine.map((f) => f.destination))].sort().map((d) => [d, routeProfile(rates, station, d, cabins, base(`${station}/${d}`), segmentRatesOf(segmentRates, station, d))]));
    // The common shock: each flight's shows against the sum of its passengers' learned booking rates.
    const shock = estimateCommonShock(mine.map((f) => {
      const ps = f.outcomes.map((o) => lookupRate(rates, bookingSegment(f, o))?.rate ?? 0.9);
      return {
        booked: f.outcomes.length, showed: f.outcomes.filter(showed).length,
        expectedShowed: ps.reduce((s, p) => s + p, 0), independentVariance: ps.reduce((s, p) => s + p * (1 - p), 0),
      };
    }));
    stations[station] = {
      profile: routeProfile(rates, station, '*', cabins, base(station), segmentRatesOf(segmentRates, station, '*')), routes,
      shockRho: shock.shock ? shock.rho : null, segments: stationSegments(segmentRates, station),
    };
  }
  return { stations };
}
