// What a committed change means to the rest of the process. Services record these inside their transaction
// (`recordEffect`); the dispatcher hands them to the subscribers (socket notices, the outbox and payments workers, the
// forecast queue, the held rankings) only once the transaction has committed.
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
}

/** Something of the station's own moved (its alerts), with no flight's notice to carry it. */
export interface StationChanged {
  type: 'station-changed';
  stationId: number;
  topics: string[];
}

/** Rows were written to the mail outbox: the workers look now instead of at their next poll. */
export interface MailQueued {
  type: 'mail-queued';
}

/** A compensation is waiting to be issued: the payments worker looks now. */
export interface PaymentQueued {
  type: 'payment-queued';
  compensationId: number;
}

export type DomainEvent = FlightChanged | StationChanged | MailQueued | PaymentQueued;
export type DomainEventType = DomainEvent['type'];
export type EventOfType<T extends DomainEventType> = Extract<DomainEvent, { type: T }>;

export const flightChanged = (flightId: number, stationId: number, topics: string[], data?: NoticeData): FlightChanged =>
  data ? { type: 'flight-changed', flightId, stationId, topics, data } : { type: 'flight-changed', flightId, stationId, topics };
export const stationChanged = (stationId: number, topics: string[]): StationChanged => ({ type: 'station-changed', stationId, topics });
export const mailQueued = (): MailQueued => ({ type: 'mail-queued' });
