// Show rates per check-in segment: at each horizon (before T−24 h, T−24 h, T−3 h, T−1 h, check-in closed) a booking is
// counted under its check-in state then, its channel, route, connection and fare group. Each horizon is learned on
// its own by the same hierarchical empirical-Bayes estimate as the booking rates (`learnShowRates`), so every booking
// counts once per horizon and the minimum-evidence rule and the shrinkage work as they do there.
import { DEFAULT_MIN_EVIDENCE, HORIZON_STATES, HORIZONS, learnShowRates, lookupRate, segmentRateKey, trainingSegments, type Horizon, type LearnedRate } from '@shared/forecast';
import { OUTCOME_CHANNELS } from '@shared/schemas/booking-channel';
import { SHOWED_OUTCOMES } from '@shared/schemas/learning';
import type { TrainingFlight, TrainingOutcome } from './train';

export type SegmentRates = Map<Horizon, Map<string, LearnedRate>>;

/** One row of the calibration screen's segment table: a station's rate at one horizon, state and channel. */
export interface SegmentRow {
  horizon: Horizon;
  state: string;
  /** A channel, or 'all' for the state's rate over every channel. */
  channel: string;
  rate: number;
  evidence: number;
  /** True when the segment had too little evidence and took its wider level's rate. */
  leansOnWider: boolean;
}

const CONNECTIONS = ['local', 'connecting'] as const;
const FARE_GROUPS = ['standard', 'flex'] as const;
const connectionOf = (o: TrainingOutcome) => (o.connecting ? 'connecting' : 'local');
const fareGroupOf = (o: TrainingOutcome) => (o.fareClass === 'flex' ? 'flex' : 'standard');

/** From the widest level to the narrowest: the state first, as it tells the most; the channel next, station-wide. */
const levels = (station: string, state: string, channel: string, route: string, connection: string, fare: string) => [station, state, channel, route, connection, fare];

export function learnSegmentRates(flights: TrainingFlight[]): SegmentRates {
  const counts = new Map<Horizon, Map<string, { booked: number; showed: number }>>(HORIZONS.map((h) => [h, new Map()]));
  for (const f of flights) {
    for (const o of f.outcomes) {
      const hit = SHOWED_OUTCOMES.has(o.outcome);
      for (const s of trainingSegments(o.checkedInAt, f.scheduledDeparture)) {
        const key = levels(String(f.stationId), s.state, o.channel || 'unknown', f.destination, connectionOf(o), fareGroupOf(o)).join('/');
        const byKey = counts.get(s.horizon)!;
        const c = byKey.get(key) ?? { booked: 0, showed: 0 };
        c.booked += 1;
        if (hit) c.showed += 1;
        byKey.set(key, c);
      }
    }
  }
  return new Map(HORIZONS.map((h) => [h, learnShowRates([...counts.get(h)!].map(([key, c]) => ({ segment: key.split('/'), ...c })))]));
}

/**
 * The rates a route's profile carries, for every segment a live passenger can be in; '*' for the station's own
 * profile (no route level). A segment never seen takes its nearest learned wider level.
 */
export function segmentRatesOf(rates: SegmentRates, station: string, route: string): Record<string, number> {
  const out: Record<string, number> = {};
  for (const s of HORIZON_STATES) {
    const learned = rates.get(s.horizon)!;
    for (const channel of OUTCOME_CHANNELS) {
      for (const connection of CONNECTIONS) {
        for (const fare of FARE_GROUPS) {
          const hit = lookupRate(learned, levels(station, s.state, channel, route, connection, fare));
          if (hit) out[segmentRateKey(s, connection, fare, channel)] = hit.rate;
        }
      }
    }
  }
  return out;
}

/** The station's rate per horizon and state, over all channels and per channel, with the evidence behind each. */
export function stationSegments(rates: SegmentRates, station: string): SegmentRow[] {
  const rows: SegmentRow[] = [];
  for (const s of HORIZON_STATES) {
    const learned = rates.get(s.horizon)!;
    for (const channel of ['all', ...OUTCOME_CHANNELS]) {
      const key = (channel === 'all' ? [station, s.state] : [station, s.state, channel]).join('/');
      const hit = learned.get(key);
      if (!hit || hit.evidence === 0) continue;
      rows.push({ horizon: s.horizon, state: s.state, channel, rate: hit.rate, evidence: hit.evidence, leansOnWider: hit.evidence < DEFAULT_MIN_EVIDENCE });
    }
  }
  return rows;
}
