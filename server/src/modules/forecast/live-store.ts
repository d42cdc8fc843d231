// The desk's payloads, built once per flight and version and served to every console from memory. A recompute that
// stored version v publishes its state here and gets back what changed since v - 1, for the notice; a read asks for
// the current version (its ETag) before anything else is done.
import type { DataSource } from 'typeorm';
import type { DeskPassenger, FlightDesk } from '@shared/schemas/flight-desk';
import { compactForecast, type ChangedPayload, type HistoryPoint, type TrailRow } from '@shared/events';
import { FlightForecastEntity, ForecastSnapshotEntity } from '../../db/entities';
import { deskOf, historyPointOf, passengersOf, rowChanged, trailRowOf } from './desk-payloads';
import { readFlightState, type FlightState } from './flight-state';

export type PayloadKind = 'desk' | 'passengers' | 'events' | 'history';

export interface LiveEntry {
  flightId: number;
  stationId: number;
  version: number;
  at: Date;
  desk: FlightDesk;
  /** The rows consoles hold, in list order (see rowChanged). */
  passengers: DeskPassenger[];
  trail: TrailRow[];
  /** Serialized payloads of this version, made on first request. */
  json: Map<PayloadKind, Promise<string>>;
}

/** The notice's data: what a console at version - 1 needs to reach `version`. */
export type NoticeData = Required<Omit<ChangedPayload, 'id' | 'topics' | 'ranking'>>;

/** Figures that move with time alone by less than these are not news (the desk shows whole percents). */
const MOVED = { pOversale: 0.0005, expectedDenied: 0.005, mean: 0.05 };

function figuresMoved(a: FlightDesk, b: FlightDesk): boolean {
  if (JSON.stringify(a.flight) !== JSON.stringify(b.flight) || JSON.stringify(a.totals) !== JSON.stringify(b.totals)) return true;
  if (a.cabins.some((c, i) => c.checkedIn !== b.cabins[i]?.checkedIn || c.booked !== b.cabins[i]?.booked || c.boarded !== b.cabins[i]?.boarded)) return true;
  const f = a.forecast;
  const g = b.forecast;
  if (!f || !g) return f !== g;
  return Math.abs(f.pOversale - g.pOversale) >= MOVED.pOversale || Math.abs(f.expectedDenied - g.expectedDenied) >= MOVED.expectedDenied
    || Math.abs(f.mean - g.mean) >= MOVED.mean || f.volunteerTarget !== g.volunteerTarget || JSON.stringify(f.shock) !== JSON.stringify(g.shock)
    || f.riskTolerance !== g.riskTolerance || f.capacity !== g.capacity;
}

interface Built {
  entry: LiveEntry;
  changed: DeskPassenger[] | null;
  newTrail: TrailRow[] | null;
}

function build(state: FlightState, version: number, prev: LiveEntry | undefined): Built {
  const fresh = passengersOf(state);
  const trail = state.trail.map(trailRowOf);
  let passengers = fresh;
  let changed: DeskPassenger[] | null = null;
  let newTrail: TrailRow[] | null = null;
  if (prev) {
    const held = new Map(prev.passengers.map((p) => [p.id, p]));
    const list: DeskPassenger[] = [];
    passengers = fresh.map((row) => {
      const was = held.get(row.id);
      if (!rowChanged(was, row)) return was!;
      list.push(row);
      return row;
    });
    // A patch adds and replaces rows; a passenger gone from the list (a booking sent again) needs the list anew.
    const ids = new Set(fresh.map((p) => p.id));
    changed = prev.passengers.every((p) => ids.has(p.id)) ? list : null;
    const seen = new Set(prev.trail.map((t) => t.id));
    newTrail = trail.filter((t) => !seen.has(t.id));
  }
  const entry: LiveEntry = { flightId: state.flight.id, stationId: state.flight.stationId, version, at: state.at, desk: deskOf(state, version), passengers, trail, json: new Map() };
  return { entry, changed, newTrail };
}

export class LiveStore {
  private readonly entries = new Map<number, LiveEntry>();
  private readonly loading = new Map<number, Promise<LiveEntry | null>>();
  private readonly lastSnapshot = new Map<number, { at: Date; pOversale: number } | null>();
  private readonly evictListeners = new Set<(flightId: number) => void>();

  constructor(private readonly db: DataSource) {}

  /** Called with each flight dropped from memory, so what is built from its payloads goes too. */
  onEvict(listener: (flightId: number) => void) {
    this.evictListeners.add(listener);
  }

  /**
   * Keeps only these flights (the open ones): a departed flight's payloads leave memory, and are read again from the
   * database if someone still asks for them.
   */
  keepOnly(open: ReadonlySet<number>) {
    for (const flightId of [...this.entries.keys()]) {
      if (open.has(flightId)) continue;
      this.entries.delete(flightId);
      this.lastSnapshot.delete(flightId);
      this.evictListeners.forEach((l) => l(flightId));
    }
  }

  /** Another process stored `version`: a held older one is dropped and read again from the database when asked. */
  dropOlder(flightId: number, version: number) {
    const held = this.entries.get(flightId);
    if (held && held.version < version) this.entries.delete(flightId);
  }

  /** Flights held in memory. */
  size(): number {
    return this.entries.size;
  }

  get(flightId: number): LiveEntry | undefined {
    return this.entries.get(flightId);
  }

  /** Whether `state` shows anything the consoles at the current version do not have. */
  moved(state: FlightState): boolean {
    const prev = this.entries.get(state.flight.id);
    if (!prev) return true;
    const { entry, changed, newTrail } = build(state, prev.version, prev);
    return changed === null || changed.length > 0 || (newTrail?.length ?? 1) > 0 || figuresMoved(prev.desk, entry.desk);
  }

  /** Stores version `version` of the flight and returns what a notice must carry; null if a newer one is held. */
  publish(state: FlightState, version: number, point: HistoryPoint | null): NoticeData | null {
    const prev = this.entries.get(state.flight.id);
    if (prev && prev.version >= version) return null;
    const base = prev && prev.version === version - 1 ? prev : undefined;
    const { entry, changed, newTrail } = build(state, version, base);
    this.entries.set(entry.flightId, entry);
    const { station: _station, ...figures } = entry.desk;
    return { version, desk: { ...figures, version, forecast: figures.forecast && compactForecast(figures.forecast) }, passengers: changed, events: newTrail, point };
  }

  /** The latest snapshot of the odds chart (cached after the first read), to decide whether a new point is due. */
  async latestSnapshot(flightId: number) {
    if (!this.lastSnapshot.has(flightId)) {
      const last = await this.db.getRepository(ForecastSnapshotEntity).findOne({ select: { at: true, pOversale: true }, where: { flightId }, order: { at: 'DESC' } });
      this.lastSnapshot.set(flightId, last ? { at: last.at, pOversale: last.pOversale } : null);
    }
    return this.lastSnapshot.get(flightId) ?? null;
  }

  noteSnapshot(flightId: number, at: Date, pOversale: number) {
    this.lastSnapshot.set(flightId, { at, pOversale });
  }

  /**
   * The current version of a flight. Without one in memory (a restart), the stored version is rebuilt from the
   * database as of its own moment, read only: a GET never writes. A flight never computed gets version 0.
   */
  async current(flightId: number): Promise<LiveEntry | null> {
    const held = this.entries.get(flightId);
    if (held) return held;
    let pending = this.loading.get(flightId);
    if (!pending) {
      pending = this.load(flightId).finally(() => this.loading.delete(flightId));
      this.loading.set(flightId, pending);
    }
    return pending;
  }

  private async load(flightId: number): Promise<LiveEntry | null> {
    const stored = await this.db.getRepository(FlightForecastEntity).findOne({ select: { flightId: true, version: true, computedAt: true }, where: { flightId } });
    const state = await readFlightState(this.db, flightId, stored?.computedAt);
    if (!state) return null;
    const { entry } = build(state, stored?.version ?? 0, undefined);
    const now = this.entries.get(flightId);
    if (now && now.version >= entry.version) return now;
    this.entries.set(flightId, entry);
    return entry;
  }

  /** The serialized payload of `entry`'s version, made once. */
  payload(entry: LiveEntry, kind: PayloadKind): Promise<string> {
    let json = entry.json.get(kind);
    if (!json) {
      json = this.serialize(entry, kind);
      entry.json.set(kind, json);
      json.catch(() => entry.json.delete(kind));
    }
    return json;
  }

  private async serialize(entry: LiveEntry, kind: PayloadKind): Promise<string> {
    const version = entry.version;
    if (kind === 'desk') return JSON.stringify(entry.desk);
    if (kind === 'passengers') return JSON.stringify({ version, passengers: entry.passengers });
    if (kind === 'events') return JSON.stringify({ version, events: entry.trail });
    // The odds history as stored up to this version's moment: later points belong to later versions.
    const points = await this.db.getRepository(ForecastSnapshotEntity).find({ where: { flightId: entry.flightId }, order: { at: 'ASC' }, take: 2000 });
    return JSON.stringify({ version, points: points.filter((p) => p.at <= entry.at).map(historyPointOf) });
  }
}

const stores = new WeakMap<DataSource, LiveStore>();

/** One store per database (each test app has its own). */
export function liveStoreOf(db: DataSource): LiveStore {
  let store = stores.get(db);
  if (!store) stores.set(db, (store = new LiveStore(db)));
  return store;
}
