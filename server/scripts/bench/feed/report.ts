// The figures of one feed-latency run: printed as a two-column table, and kept as JSON for the bench summary.
import type { CountCheck } from './verify';
import type { LatencyFigures } from './ledger';
import type { HoldFigures } from './hold-ledger';
import type { ThroughputFigures } from './throughput';
import type { BrowserFigures } from './browser-probe';
import type { LoadFigures } from './load';
import type { CpuReport, Memory } from './proc-stats';
import { ms } from './stats';

export const GOAL_P99_MS = 250;
/** Targets per event, amortised over the run: server work and what each console watching the flight receives. */
export const TARGETS = { serverCpuMs: 1.5, sqlStatements: 4, bytesPerConsole: 2048 };

export interface FeedBenchResult {
  settings: { rate: number; seconds: number; flights: number; clients: number; sessions: number };
  load: LoadFigures;
  latency: LatencyFigures;
  counts: CountCheck;
  holds: HoldFigures;
  throughput: ThroughputFigures | null;
  browser: BrowserFigures | null;
  perEvent: { requestsPerConsole: number; bytesPerConsole: number; serverCpuMs: number; sqlStatements: number };
  traffic: {
    requests: number; bytes: number; notices: number; noticeBytes: number; discarded: number; aborted: number; patched: number;
    byPath: Record<string, { requests: number; bytes: number }>; consolesHoldingExactCount: number;
  };
  server: { pid: number | null; cpu: CpuReport | null; memoryBefore: Memory | null; memoryAfter: Memory | null };
  database: { pid: number | null; cpu: CpuReport | null };
  machine: { busyPercent: number; cores: number };
  bench: { cpuPercent: number; eventLoopDelayP99Ms: number; disconnects: number };
  goal: { p99UnderMs: number; latencyMet: boolean; nothingLost: boolean };
}

const against = (value: number, target: number, unit: string, digits = 1) =>
  `${Number.isFinite(value) ? value.toFixed(digits) : 'n/a'} ${unit} (target <= ${target} ${unit}: ${value <= target ? 'met' : 'NOT met'})`;

export function goalOf(r: Omit<FeedBenchResult, 'goal'>): FeedBenchResult['goal'] {
  const s = r.load.statuses;
  const nothingLost = r.counts.exactStored === r.settings.flights && r.counts.exactShown === r.settings.flights
    && r.latency.eventsNeverCovered === 0 && r.latency.messagesPerConsole.flightsWithGaps === 0 && s.rejected + s.failed + s.duplicate === 0;
  return { p99UnderMs: GOAL_P99_MS, latencyMet: r.holds.pairs.p99 < GOAL_P99_MS, nothingLost: nothingLost && r.holds.neverReflected === 0 };
}

const cpu = (c: CpuReport | null) => (c ? `${c.averagePercent.toFixed(0)} % average, ${c.peakPercent.toFixed(0)} % busiest second (100 % = one core)` : 'n/a');
const mib = (m: Memory | null, key: keyof Memory) => (m ? `${m[key].toFixed(0)} MiB` : 'n/a');

/** Machine CPU used by processes other than the server, MariaDB and the bench: noise from whoever shares the box. */
function othersPercent(r: FeedBenchResult): number {
  const ours = (r.server.cpu?.averagePercent ?? 0) + (r.database.cpu?.averagePercent ?? 0) + r.bench.cpuPercent;
  return Math.max(0, r.machine.busyPercent - ours);
}

export function printFigures(r: FeedBenchResult): void {
  const s = r.load.statuses;
  const l = r.latency;
  const figures: Record<string, string | number> = {
    'target': `${r.settings.rate} events/s x ${r.settings.seconds} s, ${r.settings.flights} flights, ${r.settings.clients} consoles on ${r.settings.sessions} sessions`,
    'events sent / planned': `${r.load.sent} / ${r.load.planned} (${r.load.achievedRate.toFixed(1)} /s achieved, worst ${ms(r.load.maxBehindScheduleMs)} behind schedule)`,
    'feed answers': `applied ${s.applied}, superseded ${s.superseded}, duplicate ${s.duplicate}, rejected ${s.rejected}, failed ${s.failed}`,
    ...(r.load.firstRejection ? { 'first rejection': r.load.firstRejection } : {}),
    'POST round trip p50 / p99 / max': `${ms(r.load.post.p50)} / ${ms(r.load.post.p99)} / ${ms(r.load.post.max)}`,
    'POST -> console holds data reflecting it p50 / p95': `${ms(r.holds.pairs.p50)} / ${ms(r.holds.pairs.p95)}`,
    [`POST -> console holds data reflecting it p99 (target < ${GOAL_P99_MS} ms)`]: `${ms(r.holds.pairs.p99)} (${r.holds.pairs.p99 < GOAL_P99_MS ? 'met' : 'NOT met'})`,
    'POST -> console holds data reflecting it max': ms(r.holds.pairs.max),
    '(event, console) pairs measured / never reflected': `${r.holds.pairs.count} / ${r.holds.neverReflected}`,
    'consoles holding the exact checked-in count at the end': `${r.traffic.consolesHoldingExactCount} / ${r.settings.clients}`,
    'requests per console per event': r.perEvent.requestsPerConsole.toFixed(2),
    'bytes per console per event (answers + notices)': against(r.perEvent.bytesPerConsole, TARGETS.bytesPerConsole, 'B', 0),
    'server CPU per event': against(r.perEvent.serverCpuMs, TARGETS.serverCpuMs, 'ms', 2),
    'SQL statements per event': against(r.perEvent.sqlStatements, TARGETS.sqlStatements, 'statements', 1),
    'notices received / patched without a request': `${r.traffic.notices} / ${r.traffic.patched}`,
    'answers thrown away / requests aborted': `${r.traffic.discarded} / ${r.traffic.aborted}`,
    ...Object.fromEntries(Object.entries(r.traffic.byPath).map(([path, v]) => [`  GET ${path}`, `${v.requests} requests, ${(v.bytes / Math.max(1, v.requests) / 1024).toFixed(1)} KiB each`])),
    ...(r.browser ? {
      'browser: POST -> count changes in the DOM p50 / max': `${ms(r.browser.p50)} / ${ms(r.browser.max)} (${r.browser.samples.length} samples, ${r.browser.timeouts} over 30 s)`,
    } : {}),
    ...(r.throughput ? {
      'desk GET at 50 connections': `${r.throughput.desk.requestsPerSecond.toFixed(0)} req/s, p99 ${ms(r.throughput.desk.p99Ms)}, ${r.throughput.desk.non2xx} not 2xx`,
      'same middleware, constant body (GET /api/auth/session)': `${r.throughput.reference.requestsPerSecond.toFixed(0)} req/s, p99 ${ms(r.throughput.reference.p99Ms)}`,
      'desk GET / constant route (target >= 0.5)': `${r.throughput.ratio.toFixed(2)} (${r.throughput.ratio >= 0.5 ? 'met' : 'NOT met'})`,
    } : {}),
    'POST -> notice p50 (every delivery)': ms(l.deliveries.p50),
    'POST -> notice p99 (every delivery)': ms(l.deliveries.p99),
    'POST -> notice max': ms(l.deliveries.max),
    'POST -> first console p50 / p99': `${ms(l.firstConsole.p50)} / ${ms(l.firstConsole.p99)}`,
    'POST -> last console p50 / p99': `${ms(l.lastConsole.p50)} / ${ms(l.lastConsole.p99)}`,
    'POST answered -> recompute starts p50 / p99': `${ms(l.answerToRecompute.p50)} / ${ms(l.answerToRecompute.p99)}`,
    'recompute starts -> first console p50 / p99 (per update)': `${ms(l.recomputeToConsole.p50)} / ${ms(l.recomputeToConsole.p99)}`,
    'deliveries measured': l.deliveries.count,
    'updates sent to each flight room': `${l.updates} (${(l.eventsCovered / Math.max(1, l.updates)).toFixed(1)} events per update)`,
    'events covered / not covered by the end of the drain': `${l.eventsCovered} / ${l.eventsNeverCovered}`,
    'messages per console (fewest / most)': `${l.messagesPerConsole.fewest} / ${l.messagesPerConsole.most} (${l.messagesPerConsole.flightsWithGaps} flights with gaps)`,
    'attribution races': l.races,
    'checked-in counts exact (stored / shown)': `${r.counts.exactStored} / ${r.counts.exactShown} of ${r.settings.flights} flights`,
    ...(r.counts.firstMismatch ? { 'first count mismatch': r.counts.firstMismatch } : {}),
    'server CPU': cpu(r.server.cpu),
    'server RSS before / after / peak (VmHWM)': `${mib(r.server.memoryBefore, 'rssMiB')} / ${mib(r.server.memoryAfter, 'rssMiB')} / ${mib(r.server.memoryAfter, 'peakRssMiB')}`,
    'MariaDB CPU': cpu(r.database.cpu),
    'whole machine CPU busy (all processes)': `${r.machine.busyPercent.toFixed(0)} % of ${r.machine.cores * 100} %; others' share ${othersPercent(r).toFixed(0)} %`,
    'bench process CPU / event-loop delay p99': `${r.bench.cpuPercent.toFixed(0)} % / ${ms(r.bench.eventLoopDelayP99Ms)}`,
    'console disconnects': r.bench.disconnects,
    [`goal: p99 < ${GOAL_P99_MS} ms`]: r.goal.latencyMet ? 'met' : 'not met',
    'goal: nothing lost': r.goal.nothingLost ? 'met' : 'not met',
  };
  const width = Math.max(...Object.keys(figures).map((k) => k.length));
  for (const [name, value] of Object.entries(figures)) console.log(`${name.padEnd(width)}  ${value}`);
}
