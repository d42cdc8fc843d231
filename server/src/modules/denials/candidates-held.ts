// The denial ranking every console of a flight shows, built once per state of its inputs and served from memory. Its
// inputs are the flight's passengers (their changes raise the forecast version), the flight's rounds, proposals and
// denials (each such change is announced through `flightMoved`), the station's priority rules (`stationMoved`) and
// the clock at the check-in deadline. A ranking older than MAX_AGE_MS is built again, for what no notice announces
// (a denial on another flight under the same booking reference).
import { randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { diffCandidates, type CandidatesAnswer, type TaggedCandidates } from '@shared/schemas/denial-candidates-patch';
import { FlightEntity } from '../../db/entities';
import { notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { liveStoreOf } from '../forecast/live-store';
import { rankFlight } from './candidates.service';

const MAX_AGE_MS = 30_000;

const withoutDrift = (r: Omit<TaggedCandidates, 'kind' | 'tag'>) => JSON.stringify({ ...r, counts: { ...r.counts, expectedShows: null } });
const sameRanking = (a: TaggedCandidates, b: Omit<TaggedCandidates, 'kind' | 'tag'>) => {
  const { kind: _kind, tag: _tag, ...held } = a;
  return withoutDrift(held) === withoutDrift(b);
};

export interface HeldRanking {
  key: string;
  serial: number;
  builtAt: number;
  /** The check-in deadline: a ranking built before it changes when it passes (check-in closes). */
  closesAt: number;
  ranking: TaggedCandidates;
  json: string;
  /** The ranking before this one, so a console holding it gets a patch. */
  base: HeldRanking | null;
  patchJson?: string | null;
}

export class HeldRankings {
  private readonly flights = new Map<number, HeldRanking>();
  private readonly building = new Map<number, { key: string; promise: Promise<HeldRanking> }>();
  private readonly flightMoves = new Map<number, number>();
  private readonly stationMoves = new Map<number, number>();
  // Tags name a ranking of this process: a console that held one from a process since restarted gets the whole one.
  private readonly nonce = randomBytes(4).toString('hex');
  private serial = 0;
  /** Rankings built (not served from memory): what the tests and the bench count. */
  builds = 0;

  constructor(private readonly db: DataSource) {
    liveStoreOf(db).onEvict((flightId) => this.forget(flightId));
  }

  /** A round, proposal or denial of the flight changed. */
  flightMoved(flightId: number) {
    this.flightMoves.set(flightId, (this.flightMoves.get(flightId) ?? 0) + 1);
  }

  /** The station's priority rules changed: every ranking there. */
  stationMoved(stationId: number) {
    this.stationMoves.set(stationId, (this.stationMoves.get(stationId) ?? 0) + 1);
  }

  forget(flightId: number) {
    this.flights.delete(flightId);
    this.flightMoves.delete(flightId);
  }

  /** The flight's current ranking, if it departs from one of the user's stations (otherwise "not found"). */
  async current(user: SessionUser, flightId: number): Promise<HeldRanking> {
    const entry = await liveStoreOf(this.db).current(flightId);
    if (!entry || !canSeeStation(user, entry.stationId)) throw notFound('Flight');
    return this.heldFor(flightId, entry);
  }

  /** The flight's current ranking, for the notice that carries it to the consoles allowed to see it. */
  async latest(flightId: number): Promise<HeldRanking> {
    const entry = await liveStoreOf(this.db).current(flightId);
    if (!entry) throw notFound('Flight');
    return this.heldFor(flightId, entry);
  }

  private async heldFor(flightId: number, entry: { version: number; stationId: number }): Promise<HeldRanking> {
    const key = `${entry.version}.${this.flightMoves.get(flightId) ?? 0}.${this.stationMoves.get(entry.stationId) ?? 0}`;
    const held = this.flights.get(flightId);
    const now = Date.now();
    if (held && held.key === key && now - held.builtAt < MAX_AGE_MS && !(held.builtAt < held.closesAt && now >= held.closesAt)) return held;
    const pending = this.building.get(flightId);
    if (pending && pending.key === key) return pending.promise;
    const promise = this.build(flightId, key).finally(() => {
      if (this.building.get(flightId)?.promise === promise) this.building.delete(flightId);
    });
    this.building.set(flightId, { key, promise });
    return promise;
  }

  private async build(flightId: number, key: string): Promise<HeldRanking> {
    const serial = ++this.serial;
    const builtAt = Date.now();
    this.builds++;
    const flight = await this.db.getRepository(FlightEntity).findOneBy({ id: flightId });
    if (!flight) throw notFound('Flight');
    const { passengersById: _internal, ...ranking } = await rankFlight(this.db, flight);
    const prev = this.flights.get(flightId);
    // Most passenger changes (a chance of showing, a seat) leave the ranking as it was: it keeps its tag, and the
    // consoles holding it are told so in a few bytes. The expected shows drift with every recompute and are patched
    // from the notices, so they do not count as a change.
    const same = prev !== undefined && sameRanking(prev.ranking, ranking);
    const tag = same ? prev.ranking.tag : `${this.nonce}.${serial.toString(36)}`;
    const tagged: TaggedCandidates = { kind: 'full', tag, ...ranking };
    const made: HeldRanking = { key, serial, builtAt, closesAt: Date.parse(ranking.counts.checkInDeadline), ranking: tagged, json: JSON.stringify(tagged), base: null };
    // A build that started earlier and finished later never replaces a newer one.
    if (prev && prev.serial > serial) return made;
    if (same) {
      made.base = prev.base;
      made.patchJson = prev.patchJson;
    } else if (prev) {
      prev.base = null;
      made.base = prev;
    }
    this.flights.set(flightId, made);
    return made;
  }

  /** The answer to a console that holds the ranking tagged `since` (or none): nothing new, a patch, or the whole. */
  answer(held: HeldRanking, since: string | undefined): string {
    if (since === held.ranking.tag) return JSON.stringify({ kind: 'same', tag: since } satisfies CandidatesAnswer);
    if (since !== undefined && held.base?.ranking.tag === since) {
      if (held.patchJson === undefined) {
        const patch = diffCandidates(held.base.ranking, held.ranking);
        held.patchJson = patch && JSON.stringify(patch);
      }
      if (held.patchJson) return held.patchJson;
    }
    return held.json;
  }
}

const stores = new WeakMap<DataSource, HeldRankings>();

/** One per database (each test app has its own). */
export function heldRankingsOf(db: DataSource): HeldRankings {
  let store = stores.get(db);
  if (!store) stores.set(db, (store = new HeldRankings(db)));
  return store;
}
