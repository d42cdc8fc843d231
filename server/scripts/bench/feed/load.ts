// The departure-control feed at a steady rate: one event per POST, flights in turn, each flight's passengers in
// turn, every event flipping its passenger between checked in and not, so the load never runs out and the expected
// count of every flight is known exactly at the end.
import type { BenchFlight, BenchPassenger } from './fixture';
import type { Ledger } from './ledger';
import { percentile } from './stats';

export interface LoadOptions {
  appUrl: string;
  flights: BenchFlight[];
  keys: Map<number, string>;
  rate: number;
  seconds: number;
  runId: string;
  ledger: Ledger;
  /** Told of every applied event with its send and answer times. */
  onApplied?: (flightId: number, sentAt: number, answeredAt: number) => void;
  onProgress?: (sent: number, planned: number) => void;
}

export interface LoadFigures {
  planned: number;
  sent: number;
  statuses: Record<'applied' | 'superseded' | 'duplicate' | 'rejected' | 'failed', number>;
  achievedRate: number;
  post: { p50: number; p99: number; max: number };
  /** How far behind its schedule the latest event went out (the feed waits when too many POSTs are open). */
  maxBehindScheduleMs: number;
  firstRejection: string | null;
}

/** Open POSTs at most: past this the feed waits, and the lag shows in maxBehindScheduleMs. */
const MAX_IN_FLIGHT = 256;
const POST_TIMEOUT_MS = 30_000;
/** After the planned end the load stops sending even if it is behind, so the bench always ends. */
const OVERRUN_MS = 30_000;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export function createFeed(appUrl: string, keys: Map<number, string>, runId: string) {
  let serial = 0;
  const lastEventAt = new Map<BenchPassenger, number>();
  return {
    /** Posts one event about `p`; `checkedIn` is the state it announces. Resolves when the POST has answered. */
    async post(flight: BenchFlight, p: BenchPassenger, checkedIn: boolean, sentAt: number) {
      // Events of one passenger must carry rising timestamps: the server keeps the newest and ignores older ones.
      const occurredAt = Math.max(sentAt, (lastEventAt.get(p) ?? 0) + 1);
      lastEventAt.set(p, occurredAt);
      const event = {
        id: `bench-${runId}-${++serial}`,
        type: checkedIn ? 'passenger.checked-in' : 'check-in.cancelled',
        occurredAt: new Date(occurredAt).toISOString(),
        flight: { carrier: flight.carrier, number: flight.number, date: flight.date },
        pnr: p.pnr,
        sequence: p.sequence,
      };
      const res = await fetch(`${appUrl}/api/integrations/events`, {
        method: 'POST',
        headers: { Authorization: `Bearer ${keys.get(flight.stationId)}`, 'Content-Type': 'application/json' },
        body: JSON.stringify({ events: [event] }),
        signal: AbortSignal.timeout(POST_TIMEOUT_MS),
      });
      // Headers arrive only after the server committed the event: this is the "answered" moment.
      const answeredAt = Date.now();
      const body = (await res.json().catch(() => null)) as { results?: { status: string; message?: string }[] } | null;
      const result = body?.results?.[0];
      return { answeredAt, httpStatus: res.status, status: res.ok ? (result?.status ?? 'failed') : 'failed', message: result?.message ?? `HTTP ${res.status}` };
    },
  };
}

export async function runLoad(opts: LoadOptions): Promise<LoadFigures> {
  const planned = Math.round(opts.rate * opts.seconds);
  const feed = createFeed(opts.appUrl, opts.keys, opts.runId);
  const cursors = opts.flights.map(() => 0);
  const statuses = { applied: 0, superseded: 0, duplicate: 0, rejected: 0, failed: 0 };
  const postMs: number[] = [];
  let firstRejection: string | null = null;
  let sent = 0;
  let inFlight = 0;
  let maxBehind = 0;
  const start = Date.now();

  const sendOne = (i: number) => {
    const f = i % opts.flights.length;
    const flight = opts.flights[f];
    const p = flight.passengers[cursors[f]++ % flight.passengers.length];
    p.checkedIn = !p.checkedIn;
    const sentAt = Date.now();
    maxBehind = Math.max(maxBehind, sentAt - (start + (i * 1000) / opts.rate));
    const done = opts.ledger.sent(flight.id, sentAt);
    inFlight++;
    feed.post(flight, p, p.checkedIn, sentAt).then(
      (r) => {
        postMs.push(r.answeredAt - sentAt);
        const key = r.status in statuses ? (r.status as keyof typeof statuses) : 'failed';
        statuses[key]++;
        if (key !== 'applied' && key !== 'superseded') firstRejection ??= `${key}: ${r.message}`;
        done(key === 'applied' || key === 'superseded', r.answeredAt);
        if (key === 'applied' || key === 'superseded') opts.onApplied?.(flight.id, sentAt, r.answeredAt);
      },
      (err: unknown) => {
        statuses.failed++;
        firstRejection ??= `failed: ${err instanceof Error ? err.message : String(err)}`;
        done(false, Date.now());
      },
    ).finally(() => inFlight--);
  };

  const deadline = start + opts.seconds * 1000 + OVERRUN_MS;
  let nextProgress = start + 10_000;
  while (sent < planned && Date.now() < deadline) {
    const due = Math.min(planned, Math.floor(((Date.now() - start) * opts.rate) / 1000) + 1);
    while (sent < due && inFlight < MAX_IN_FLIGHT) sendOne(sent++);
    if (Date.now() >= nextProgress) {
      opts.onProgress?.(sent, planned);
      nextProgress += 10_000;
    }
    await sleep(2);
  }
  const sendingEndedAt = Date.now();
  for (const until = Date.now() + POST_TIMEOUT_MS + 1000; inFlight > 0 && Date.now() < until; ) await sleep(10);

  return {
    planned,
    sent,
    statuses,
    achievedRate: sent / ((sendingEndedAt - start) / 1000),
    post: { p50: percentile(postMs, 50), p99: percentile(postMs, 99), max: percentile(postMs, 100) },
    maxBehindScheduleMs: maxBehind,
    firstRejection,
  };
}
