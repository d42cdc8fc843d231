import type { DataSource } from 'typeorm';
import { compactForecast, type HistoryPoint } from '@shared/events';
import { FlightForecastEntity, ForecastSnapshotEntity } from '../../db/entities';
import { historyPointOf } from './desk-payloads';
import { readFlightState, type FlightState } from './flight-state';
import { liveStoreOf, type NoticeData } from './live-store';

/** How often the odds-over-time chart gets a point when nothing much moves. */
const SNAPSHOT_EVERY_MS = 60_000;

export interface RecomputeOutcome {
  flightId: number;
  stationId: number;
  pOversale: number;
  version: number;
  /** What the flight's consoles need to reach this version from the one before. */
  notice: NoticeData;
}

export type RecomputeResult =
  | { status: 'written'; outcome: RecomputeOutcome }
  /** The clock asked, and nothing a console shows moved: nothing written, nobody told. */
  | { status: 'unmoved' }
  /** A recompute that read later had already stored its figures: these older ones were dropped. */
  | { status: 'stale' }
  | { status: 'unknown-flight' };

/**
 * Stores the state's figures unless figures computed at a later moment are already stored: the row is locked, its
 * moment compared, and only a newer state writes, with the version one above the stored one. A recompute that read
 * its inputs earlier can therefore never overwrite one that read them later, whatever order they finish in.
 */
const RETRIED = new Set(['ER_DUP_ENTRY', 'ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT']);
const codeOf = (err: unknown) => (err as { driverError?: { code?: string } })?.driverError?.code ?? (err as { code?: string })?.code ?? '';

export async function writeIfNewer(db: DataSource, state: FlightState): Promise<{ version: number; point: HistoryPoint | null } | null> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await writeOnce(db, state);
    } catch (err) {
      // Two first writes of one flight race to insert its row: the loser reads the winner's row on the next attempt.
      if (!RETRIED.has(codeOf(err)) || attempt >= 4) throw err;
    }
  }
}

async function writeOnce(db: DataSource, state: FlightState): Promise<{ version: number; point: HistoryPoint | null } | null> {
  const flightId = state.flight.id;
  const { forecast, cabins } = state.result;
  const store = liveStoreOf(db);
  const last = await store.latestSnapshot(flightId);
  // READ COMMITTED: locking a row that does not exist yet takes no gap lock, so first writes of different flights
  // never block each other.
  return db.transaction('READ COMMITTED', async (em) => {
    const [row]: { version: number | string; computed_at: Date }[] = await em.query('SELECT version, computed_at FROM flight_forecasts WHERE flight_id = ? FOR UPDATE', [flightId]);
    if (row && new Date(row.computed_at).getTime() >= state.at.getTime()) return null;
    const version = (row ? Number(row.version) : 0) + 1;
    await em.upsert(FlightForecastEntity, {
      flightId, computedAt: state.at, version, pOversale: forecast.pOversale, expectedDenied: forecast.expectedDenied,
      forecast: compactForecast(forecast), detail: { cabins }, ratesVersion: state.ratesVersion,
    }, ['flightId']);
    const due = !last || Math.abs(last.pOversale - forecast.pOversale) >= 0.01 || state.at.getTime() - last.at.getTime() >= SNAPSHOT_EVERY_MS;
    let point: HistoryPoint | null = null;
    if (due && (!last || state.at > last.at)) {
      const checkedIn = state.passengers.filter((p) => p.status === 'checked-in' || p.status === 'boarded').length;
      const booked = state.passengers.filter((p) => p.status !== 'cancelled').length;
      const snapshot = { flightId, at: state.at, pOversale: forecast.pOversale, expectedDenied: forecast.expectedDenied, checkedIn, booked };
      await em.insert(ForecastSnapshotEntity, snapshot);
      point = historyPointOf(snapshot);
    }
    return { version, point };
  }).then((written) => {
    if (written?.point) store.noteSnapshot(flightId, state.at, forecast.pOversale);
    return written;
  });
}

/**
 * Recomputes one flight from its stored passengers, as of the database's clock now, and stores the figures (and a
 * snapshot when due). `onlyIfMoved`: the clock's tick, which writes and tells consoles only when something they
 * show has moved.
 */
export async function recomputeFlightDetailed(db: DataSource, flightId: number, opts: { onlyIfMoved?: boolean } = {}): Promise<RecomputeResult> {
  const state = await readFlightState(db, flightId);
  if (!state) return { status: 'unknown-flight' };
  const store = liveStoreOf(db);
  if (opts.onlyIfMoved && !store.moved(state)) return { status: 'unmoved' };
  const written = await writeIfNewer(db, state);
  if (!written) return { status: 'stale' };
  const notice = store.publish(state, written.version, written.point);
  // Another call of this process published a later version in between: its own notice covers this one.
  if (!notice) return { status: 'stale' };
  return { status: 'written', outcome: { flightId, stationId: state.flight.stationId, pOversale: state.result.forecast.pOversale, version: written.version, notice } };
}

/** Recomputes one flight now; the outcome when figures were stored. */
export async function recomputeFlight(db: DataSource, flightId: number): Promise<RecomputeOutcome | null> {
  const r = await recomputeFlightDetailed(db, flightId);
  return r.status === 'written' ? r.outcome : null;
}
