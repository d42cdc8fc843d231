// A console that behaves like the Flight desk in a browser: the same socket and room, the same reaction to each
// notice, the same requests with the same coalescing. What it holds is what the agent would see; the bench times
// how long it takes for that to reflect each feed event.
//
// The reaction mirrors the client's hooks for the panels the desk mounts (flight desk, denied boarding):
//  - `patch` (today's client): a notice that carries the desk's figures with the next version is patched into the
//    cache, no request; a version gap, or a notice without figures, refetches the desk's queries, and a new refetch
//    aborts the one in flight (the query functions pass TanStack Query's `signal`);
//  - `refetch` (the client before notices carried data, kept to compare): every notice refetches the four desk
//    queries; the request in flight runs on and its answer is thrown away;
//  - the denied-boarding panel (`patch`): a notice without a version refetches its candidates and proposals; a
//    forecast notice that carries the ranking is applied when it fits the ranking held (same tag, or a patch from
//    it), else the candidates are refetched naming the ranking held (`?since=tag`); a forecast notice without the
//    ranking refetches the candidates when passengers moved; in `refetch` it refetches both whole on every notice,
//    without a signal.
import type { ConsoleSocket } from './consoles';

export interface Held {
  version: number;
  computedAt: number;
  checkedIn: number;
}

export interface ConsoleCounters {
  requests: number;
  bytes: number;
  notices: number;
  noticeBytes: number;
  /** Answers thrown away because a newer refetch replaced them. */
  discarded: number;
  aborted: number;
  patched: number;
  refetches: number;
  byPath: Map<string, { requests: number; bytes: number }>;
}

export const newCounters = (): ConsoleCounters => ({ requests: 0, bytes: 0, notices: 0, noticeBytes: 0, discarded: 0, aborted: 0, patched: 0, refetches: 0, byPath: new Map() });

interface DeskNotice {
  id: number;
  version?: number;
  topics?: string[];
  passengers?: unknown[] | null;
  ranking?: { kind: 'full' | 'same' | 'patch'; tag: string; base?: string };
  desk?: { version: number; forecast: { computedAt: string } | null; totals: { checkedIn: number } };
}

/** One query of the desk: a refetch aborts the one in flight when the client passes the signal (`abortsInFlight`). */
class QuerySlot {
  controller: AbortController | null = null;
  private serial = 0;
  constructor(
    private readonly path: string | (() => string),
    private readonly fetchJson: (path: string, signal: AbortSignal) => Promise<{ body: unknown; bytes: number }>,
    private readonly counters: ConsoleCounters,
    private readonly onData: (body: unknown) => void,
    private readonly abortsInFlight: boolean,
  ) {}

  refetch(): void {
    const mine = ++this.serial;
    if (this.controller) {
      if (this.abortsInFlight) {
        this.controller.abort();
        this.counters.aborted++;
      }
    }
    const controller = new AbortController();
    this.controller = controller;
    this.counters.refetches++;
    const path = typeof this.path === 'string' ? this.path : this.path();
    // Counted by route, whatever the query string.
    const route = path.split('?')[0];
    this.fetchJson(path, controller.signal).then(
      ({ body, bytes }) => {
        const stats = this.counters.byPath.get(route) ?? { requests: 0, bytes: 0 };
        stats.requests++;
        stats.bytes += bytes;
        this.counters.byPath.set(route, stats);
        if (mine !== this.serial) {
          this.counters.discarded++;
          return;
        }
        this.controller = null;
        this.onData(body);
      },
      () => {
        if (mine === this.serial) this.controller = null;
      },
    );
  }
}

export type ClientModel = 'patch' | 'refetch';

export interface DeskConsoleOptions {
  model: ClientModel;
  appUrl: string;
  cookie: string;
  flightId: number;
  socket: ConsoleSocket;
  onHeld: (held: Held, at: number) => void;
}

export class DeskConsole {
  readonly counters = newCounters();
  held: Held | null = null;
  private readonly desk: QuerySlot;
  private readonly others: QuerySlot[];
  private readonly denials: QuerySlot[];
  private readonly candidates: QuerySlot;
  private readonly proposals: QuerySlot;
  private rankingTag: string | null = null;

  constructor(private readonly opts: DeskConsoleOptions) {
    const base = `/api/flights/${opts.flightId}`;
    const slot = (path: string | (() => string), onData: (b: unknown) => void, aborts: boolean) => new QuerySlot(path, (p, s) => this.get(p, s), this.counters, onData, aborts);
    const aborts = opts.model === 'patch';
    this.desk = slot(base, (b) => this.hold(b as DeskNotice['desk']), aborts);
    this.others = [
      slot(`${base}/passengers`, () => undefined, aborts),
      slot(`${base}/forecast-history`, () => undefined, aborts),
      slot(`${base}/events`, () => undefined, aborts),
    ];
    const candidates = `${base}/denial-candidates`;
    const patching = opts.model === 'patch';
    // The ranking's tag: kept from the last answer, named in the next request as the client does.
    const keepTag = (b: unknown) => {
      const tag = (b as { tag?: unknown } | null)?.tag;
      if (patching && typeof tag === 'string') this.rankingTag = tag;
    };
    this.candidates = slot(() => (this.rankingTag ? `${candidates}?since=${this.rankingTag}` : candidates), keepTag, patching);
    this.proposals = slot(`${base}/denial-proposals`, () => undefined, patching);
    this.denials = [this.candidates, this.proposals];
    opts.socket.on('flight:changed', (p) => this.onNotice(p as DeskNotice));
  }

  private async get(path: string, signal: AbortSignal): Promise<{ body: unknown; bytes: number }> {
    this.counters.requests++;
    const res = await fetch(`${this.opts.appUrl}${path}`, { headers: { Cookie: this.opts.cookie, Accept: 'application/json' }, signal });
    const text = await res.text();
    // Body plus a rough header size: what crosses the wire for this answer.
    this.counters.bytes += text.length + 300;
    return { body: res.ok && text ? JSON.parse(text) : null, bytes: text.length + 300 };
  }

  private hold(desk: DeskNotice['desk'] | null | undefined) {
    if (!desk?.forecast) return;
    const held = { version: desk.version ?? 0, computedAt: Date.parse(desk.forecast.computedAt), checkedIn: desk.totals.checkedIn };
    if (this.held && held.computedAt < this.held.computedAt) return;
    this.held = held;
    this.opts.onHeld(held, Date.now());
  }

  /** Holds the desk and has no request open. */
  idle(): boolean {
    return this.held !== null && [this.desk, ...this.others, ...this.denials].every((s) => s.controller === null);
  }

  /** First load, as the desk does when it mounts. */
  load(): void {
    this.desk.refetch();
    this.others.forEach((s) => s.refetch());
    this.denials.forEach((s) => s.refetch());
  }

  /** As the client applies a ranking a notice carries: held unless it does not fit the ranking held. */
  private takeRanking(r: NonNullable<DeskNotice['ranking']>) {
    if (this.rankingTag === null) return;
    const fits = r.kind === 'full' || (r.kind === 'same' ? r.tag === this.rankingTag : r.base === this.rankingTag);
    if (fits) this.rankingTag = r.tag;
    else this.candidates.refetch();
  }

  private onNotice(p: DeskNotice) {
    this.counters.notices++;
    this.counters.noticeBytes += JSON.stringify(p).length;
    if (this.opts.model === 'refetch' || p.version === undefined) this.denials.forEach((s) => s.refetch());
    else if (p.ranking) this.takeRanking(p.ranking);
    else if (p.passengers === undefined || p.passengers === null || p.passengers.length > 0) this.candidates.refetch();
    if (this.opts.model === 'patch' && p.desk && this.held) {
      if (p.desk.version === this.held.version + 1) {
        this.counters.patched++;
        this.hold(p.desk);
        return;
      }
      if (p.desk.version <= this.held.version) return;
    }
    this.desk.refetch();
    this.others.forEach((s) => s.refetch());
  }
}
