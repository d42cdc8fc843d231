// What a committed change means to the rest of the process. Services record these inside their transaction
// (`recordEffect`); the dispatcher hands them to the subscribers (socket notices, the outbox worker, the forecast queue,
// the held rankings) only once the transaction has committed.
import type { ChangedPayload } from '@shared/events';
import type { NoticeData } from '../realtime/publisher';

/** A flight's state moved: consoles watching it refetch (or patch) the named topics. */
export interface FlightChanged {
  type: 'flight-changed';
  flightId: number;
  stationId: number;
  /** What moved: counts, forecast, rounds, denials, compensations, notices, care… */
  topics: string[];
  /** A forecast's notice carries the new version and what changed with it. */
  data?: NoticeData;
  /** For the consoles that work the flight's denied boarding only: the ranking as of that version. */
  desk?: Pick<ChangedPayload, 'ranking'>;
}

/** Something of the station's own moved (its alerts), with no flight's notice to carry it. */
export interface StationChanged {
  type: 'station-changed';
  stationId: number;
  topics: string[];
}

/** A station's denial priority rules changed: every ranking held for its flights is built anew (no console notice). */
export interface PriorityRulesChanged {
  type: 'priority-rules-changed';
  stationId: number;
}

/** Rows were written to the mail outbox: the workers look now instead of at their next poll. */
export interface MailQueued {
  type: 'mail-queued';
}

/** The forecast's inputs moved (passengers, a round, a denial, the flight's capacity): it is recomputed, coalesced. */
export interface ForecastStale {
  type: 'forecast-stale';
  flightId: number;
}

export type DomainEvent = FlightChanged | StationChanged | ForecastStale | PriorityRulesChanged | MailQueued;
export type DomainEventType = DomainEvent['type'];
export type EventOfType<T extends DomainEventType> = Extract<DomainEvent, { type: T }>;

export const flightChanged = (flightId: number, stationId: number, topics: string[], data?: NoticeData): FlightChanged =>
  data ? { type: 'flight-changed', flightId, stationId, topics, data } : { type: 'flight-changed', flightId, stationId, topics };
export const stationChanged = (stationId: number, topics: string[]): StationChanged => ({ type: 'station-changed', stationId, topics });
export const forecastStale = (flightId: number): ForecastStale => ({ type: 'forecast-stale', flightId });
export const mailQueued = (): MailQueued => ({ type: 'mail-queued' });

/**
 * A change on a flight the desk shows: its consoles' notice, and when the forecast is among the topics, a recompute
 * (whose own notice then brings the new figures).
 */
export const flightMoved = (flightId: number, stationId: number, topics: string[]): DomainEvent[] =>
  topics.includes('forecast') ? [flightChanged(flightId, stationId, topics), forecastStale(flightId)] : [flightChanged(flightId, stationId, topics)];

/**
 * What one commit announces: a flight's plain notices merge into one per flight (topics in the order first named), and
 * a repeated wake-up or recompute request counts once, so a service may record an effect wherever it decides it.
 * Notices carrying data (a forecast's version) stay as they are.
 */
export function coalesce(events: readonly DomainEvent[]): DomainEvent[] {
  const out: DomainEvent[] = [];
  const flights = new Map<number, FlightChanged>();
  const seen = new Set<string>();
  for (const e of events) {
    if (e.type === 'flight-changed' && !e.data) {
      const held = flights.get(e.flightId);
      if (held) held.topics = [...new Set([...held.topics, ...e.topics])];
      else {
        const copy = { ...e, topics: [...new Set(e.topics)] };
        flights.set(e.flightId, copy);
        out.push(copy);
      }
      continue;
    }
    const key = e.type === 'mail-queued' ? e.type : e.type === 'forecast-stale' ? `${e.type}:${e.flightId}` : null;
    if (key !== null) {
      if (seen.has(key)) continue;
      seen.add(key);
    }
    out.push(e);
  }
  return out;
}
