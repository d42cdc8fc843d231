// socket.io event names and payloads. A flight's notice carries what changed with the flight's forecast version, so
// a console patches its cache and asks the API again only when it missed a version (a gap) or after a reconnect.
import type { CandidatesAnswer } from './schemas/denial-candidates-patch';
import type { DeskPassenger, FlightDesk, Forecast } from './schemas/flight-desk';

export const SOCKET_EVENTS = {
  watchStation: 'station:watch',
  watchFlight: 'flight:watch',
  unwatchFlight: 'flight:unwatch',
  flightChanged: 'flight:changed',
  stationChanged: 'station:changed',
} as const;

/** The station notice's topic when its alerts may have changed: consoles fetch their alerts again. */
export const ALERT_TOPIC = 'alerts';

export const flightRoom = (flightId: number) => `flight:${flightId}`;
export const stationRoom = (stationId: number) => `station:${stationId}`;
/** The flight's consoles that show the denial ranking: their notices carry it. */
export const flightDeskRoom = (flightId: number) => `flight:${flightId}:desk`;

/**
 * The part of a show-up distribution worth sending: entries below PMF_FLOOR are sent as absent and values keep
 * PMF_DIGITS significant digits. The chart draws nothing below 1e-4 and the risk figures travel separately, exactly.
 */
export const PMF_FLOOR = 1e-9;
const PMF_DIGITS = 6;

export interface PmfWindow {
  /** Index of the first value sent: P(shows = start). */
  start: number;
  values: number[];
  /** Length of the full distribution (people + 1). */
  length: number;
}

export function pmfWindow(pmf: readonly number[]): PmfWindow {
  let lo = 0;
  let hi = pmf.length - 1;
  while (lo < hi && pmf[lo] < PMF_FLOOR) lo++;
  while (hi > lo && pmf[hi] < PMF_FLOOR) hi--;
  const values: number[] = [];
  for (let k = lo; k <= hi; k++) values.push(Number(pmf[k].toPrecision(PMF_DIGITS)));
  return { start: lo, values, length: pmf.length };
}

export function expandPmf(w: PmfWindow): number[] {
  const pmf = new Array<number>(w.length).fill(0);
  w.values.forEach((v, i) => (pmf[w.start + i] = v));
  return pmf;
}

/** A forecast as it travels in a notice: the same figures, the distribution as a window. */
export type CompactForecast = Omit<Forecast, 'pmf'> & { pmf: PmfWindow };

export const compactForecast = (f: Forecast): CompactForecast => ({ ...f, pmf: pmfWindow(f.pmf) });
export const expandForecast = (f: CompactForecast): Forecast => ({ ...f, pmf: expandPmf(f.pmf) });

/** What moved on the desk's header, counts and odds: everything of the desk but the station, which never moves. */
export interface DeskFigures {
  version: number;
  flight: FlightDesk['flight'];
  cabins: FlightDesk['cabins'];
  totals: FlightDesk['totals'];
  forecast: CompactForecast | null;
}

export interface TrailRow {
  id: number;
  eventId: string;
  type: string;
  occurredAt: string;
  receivedAt: string;
  status: string;
  summary: string;
}

export interface HistoryPoint {
  at: string;
  pOversale: number;
  expectedDenied: number;
  checkedIn: number;
  booked: number;
}

export interface ChangedPayload {
  id: number;
  /** What moved, so a client can refetch only that: counts, forecast, rounds, denials… */
  topics?: string[];
  /** The flight's forecast version this notice brings a console to (present on the forecast's own notices). */
  version?: number;
  desk?: DeskFigures;
  /** Passengers whose row changed since the previous version; null when the server cannot tell (refetch). */
  passengers?: DeskPassenger[] | null;
  /** Event-trail rows received since the previous version, newest first; null when unknown (refetch). */
  events?: TrailRow[] | null;
  /** The odds-over-time point this version added, if it added one. */
  point?: HistoryPoint | null;
  /**
   * The denial ranking as of this version, for the consoles that show it: unchanged, a patch from the ranking the
   * previous notice brought, or whole. A console holding another ranking asks the API.
   */
  ranking?: CandidatesAnswer;
}

export interface ServerToClientEvents {
  'flight:changed': (p: ChangedPayload) => void;
  'station:changed': (p: ChangedPayload) => void;
}

export interface ClientToServerEvents {
  'station:watch': (stationId: number, ack?: (r: { ok: boolean }) => void) => void;
  'flight:watch': (flightId: number, ack?: (r: { ok: boolean }) => void) => void;
  'flight:unwatch': (flightId: number) => void;
}
