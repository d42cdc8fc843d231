/**
 * Feed-to-console latency under the load the product is sized for: BENCH_RATE feed events per second (default 200)
 * for BENCH_SECONDS (default 60) across 20 flights, watched by 300 socket.io consoles. Prints the latency from each
 * event's POST to every console's "flight changed" message (p50, p99; the goal is p99 under 250 ms), checks that no
 * event was lost (every flight's checked-in count, stored and shown, equals what the events imply), and the CPU and
 * memory of the server process. Prints figures; asserts nothing (exit 0 unless the bench itself could not run).
 *
 * Run against a running stack (`npm run bench` brings one up on its own ports):
 *   BENCH_APP_URL=http://127.0.0.1:4900 DATABASE_URL=mariadb://… node_modules/.bin/tsx server/scripts/bench/feed-latency.bench.ts
 * Optional: BENCH_SERVER_PID (the server's PID or that of the tsx wrapper that started it; otherwise found by the
 * port), BENCH_DB_PID (MariaDB's PID, for its CPU), BENCH_RESULT_FILE (figures as JSON), BENCH_FLIGHTS (20),
 * BENCH_CLIENTS (300), BENCH_SESSIONS (5 sign-ins shared by the clients).
 * It adds flights (copies of demo flights) and a feed key per station to the database it is given: use a bench one.
 */
import { writeFileSync } from 'node:fs';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { createDataSource } from '../../src/db/data-source';
import { DEMO_PASSWORD, DEMO_USERS } from '../../src/demo/scenario';
import { openConsoles, signIn } from './feed/consoles';
import { DeskConsole } from './feed/desk-console';
import { compareThroughput } from './feed/throughput';
import { openBrowserProbe, type BrowserProbe } from './feed/browser-probe';
import { HoldLedger } from './feed/hold-ledger';
import { cpuSeconds } from './feed/proc-stats';
import { createStationKeys, ensureFlights, forecastComputedAt, loadBenchFlights } from './feed/fixture';
import { Ledger } from './feed/ledger';
import { createFeed, runLoad } from './feed/load';
import { memory, pidListeningOn, sampleCpu, sampleMachine, type CpuReport } from './feed/proc-stats';
import { goalOf, printFigures, type FeedBenchResult } from './feed/report';
import { readSettings } from './feed/settings';
import { verifyCounts } from './feed/verify';
import { expectedCheckedIn } from './feed/fixture';
import type { ConsoleCounters } from './feed/desk-console';
import type { DataSource } from 'typeorm';

/** Statements the database server has received so far (its own counter, all clients). */
async function questions(db: DataSource): Promise<number> {
  const rows: { Value: string }[] = await db.query(`SHOW GLOBAL STATUS LIKE 'Questions'`);
  return Number(rows[0]?.Value ?? NaN);
}

/** What the consoles asked and received during the load: totals, and per path. */
function trafficOf(now: ConsoleCounters[], before: ConsoleCounters[]) {
  const sum = (pick: (c: ConsoleCounters) => number) => now.reduce((a, c, i) => a + pick(c) - pick(before[i]), 0);
  const byPath = new Map<string, { requests: number; bytes: number }>();
  now.forEach((c, i) => {
    for (const [path, v] of c.byPath) {
      const key = path.replace(/\/\d+/g, '/:id');
      const was = before[i].byPath.get(path) ?? { requests: 0, bytes: 0 };
      const t = byPath.get(key) ?? { requests: 0, bytes: 0 };
      t.requests += v.requests - was.requests;
      t.bytes += v.bytes - was.bytes;
      byPath.set(key, t);
    }
  });
  return {
    requests: sum((c) => c.requests), bytes: sum((c) => c.bytes), notices: sum((c) => c.notices), noticeBytes: sum((c) => c.noticeBytes),
    discarded: sum((c) => c.discarded), aborted: sum((c) => c.aborted), patched: sum((c) => c.patched),
    byPath: Object.fromEntries(byPath),
  };
}

const QUIET_MS = 600;
/** Consoles sign in as the demo's gate agent, who works every demo station. */
const DEMO_AGENT = DEMO_USERS.find((u) => u.role === 'agent') ?? DEMO_USERS[0];
/** After the load, how long updates may still trail in: a backlog of a whole run is still late, not lost. */
const drainTimeoutMs = (seconds: number) => 15_000 + seconds * 1000;
const sleep = (t: number) => new Promise((r) => setTimeout(r, t));

const settings = readSettings(process.env);
const log = (line: string) => console.log(`[feed-latency] ${line}`);

async function main() {
  const db = createDataSource(settings.databaseUrl);
  await db.initialize();
  let consoles: Awaited<ReturnType<typeof openConsoles>> | null = null;
  try {
    // One flight more than the load drives, for the browser's own samples.
    const allIds = await ensureFlights(db, settings.flights + (settings.browser ? 1 : 0));
    const flightIds = allIds.slice(0, settings.flights);
    const probeFlight = settings.browser ? (await loadBenchFlights(db, allIds.slice(settings.flights)))[0] : null;
    const flights = await loadBenchFlights(db, flightIds);
    const empty = flights.find((f) => f.passengers.length < 2);
    if (empty) throw new Error(`flight ${empty.carrier}${empty.number} has fewer than 2 passengers an event can move`);
    const keys = await createStationKeys(db, [...flights, ...(probeFlight ? [probeFlight] : [])].map((f) => f.stationId));
    const cookies: string[] = [];
    for (let i = 0; i < settings.sessions; i++) cookies.push(await signIn(settings.appUrl, DEMO_AGENT.email, DEMO_PASSWORD));
    log(`${flights.length} flights (${flights.reduce((s, f) => s + f.passengers.length, 0)} passengers in play), ${cookies.length} sessions`);

    // The bench's own look-ups are subtracted from the server's SQL statement count.
    let ownStatements = 0;
    const ledger = new Ledger(flightIds, (id) => {
      ownStatements++;
      return forecastComputedAt(db, id);
    });
    const consolesOf = new Map<number, number[]>();
    const holds = new HoldLedger((id) => consolesOf.get(id) ?? []);
    let lastMessageAt = Date.now();
    consoles = await openConsoles({
      appUrl: settings.appUrl, cookies, flightIds, clients: settings.clients,
      onChanged: (client, flightId, at) => {
        lastMessageAt = at;
        ledger.received(client, flightId, at);
      },
    });
    const desks = consoles.sockets.map((socket, i) => {
      const flightId = flightIds[i % flightIds.length];
      consolesOf.set(flightId, [...(consolesOf.get(flightId) ?? []), i]);
      return new DeskConsole({
        model: settings.clientModel, appUrl: settings.appUrl, cookie: cookies[i % cookies.length], flightId, socket,
        onHeld: (held, at) => holds.held(i, flightId, held.computedAt, at),
      });
    });
    desks.forEach((d) => d.load());
    // Every console first holds the desk as it opens, as an agent's screen would, before anything is counted.
    for (const until = Date.now() + 60_000; desks.some((d) => !d.idle()) && Date.now() < until; ) await sleep(50);
    log(`${consoles.sockets.length} consoles connected and watching, each behaving like the desk (client model "${settings.clientModel}")`);
    // Start-up recomputes may still be reaching some consoles: start counting updates only once all is quiet.
    for (const until = Date.now() + 10_000; Date.now() - lastMessageAt < QUIET_MS && Date.now() < until; ) await sleep(50);
    await ledger.settle();
    ledger.reset();
    const countersBefore = desks.map((d) => ({ ...d.counters, byPath: new Map([...d.counters.byPath].map(([k, v]) => [k, { ...v }])) }));
    const statementsBefore = await questions(db);
    holds.start();

    const serverPid = pidListeningOn(Number(new URL(settings.appUrl).port || 80), settings.serverPid);
    if (!serverPid) log('could not find the server process by its port: CPU and memory are not reported');
    const memoryBefore = serverPid ? memory(serverPid) : null;
    const serverCpu = serverPid ? sampleCpu(serverPid) : null;
    const serverCpuStart = serverPid ? cpuSeconds(serverPid) : NaN;
    const dbCpu = settings.dbPid ? sampleCpu(settings.dbPid) : null;
    const machine = sampleMachine();
    const benchCpuStart = process.cpuUsage();
    const benchStart = Date.now();
    const loopDelay = monitorEventLoopDelay({ resolution: 10 });
    loopDelay.enable();

    let probe: BrowserProbe | null = null;
    if (probeFlight) {
      try {
        probe = await openBrowserProbe({ appUrl: settings.appUrl, cookie: cookies[0], flight: probeFlight, feed: createFeed(settings.appUrl, keys, `${settings.runId}-browser`) });
      } catch (err) {
        log(`the browser could not open the desk (${err instanceof Error ? err.message : String(err)}): no browser figures`);
      }
    }
    log(`load: ${settings.rate} events/s for ${settings.seconds} s`);
    const browserRun = probe?.run(Date.now() + settings.seconds * 1000, 20) ?? Promise.resolve(null);
    const load = await runLoad({
      appUrl: settings.appUrl, flights, keys, rate: settings.rate, seconds: settings.seconds, runId: settings.runId, ledger,
      onApplied: (flightId, sentAt, answeredAt) => holds.answered(flightId, sentAt, answeredAt),
      onProgress: (sent, planned) => log(`${sent} / ${planned} events sent`),
    });

    const browser = await browserRun.catch(() => null);
    await probe?.close();

    // Re-announce one passenger per flight as they already stand (counts do not move): a last recompute covers events
    // whose POST answered after the previous recompute had started. These events are not measured.
    await sleep(200);
    const sweep = createFeed(settings.appUrl, keys, `${settings.runId}-sweep`);
    // A sweep POST that times out on an overloaded machine costs only that flight's last recompute, not the figures.
    const swept = await Promise.allSettled(flights.map((f) => sweep.post(f, f.passengers[0], f.passengers[0].checkedIn, Date.now())));
    const unswept = swept.filter((r) => r.status === 'rejected').length;
    if (unswept) log(`${unswept} sweep POSTs failed (the server is overloaded); their flights may end a recompute behind`);
    for (const until = Date.now() + drainTimeoutMs(settings.seconds); Date.now() < until; ) {
      await ledger.settle();
      if (ledger.uncovered() === 0 && holds.behind() === 0 && Date.now() - lastMessageAt >= QUIET_MS) break;
      await sleep(50);
    }
    await ledger.settle();
    const serverCpuSeconds = serverPid ? cpuSeconds(serverPid) - serverCpuStart : NaN;
    const statements = (await questions(db)) - statementsBefore - ownStatements - 1;
    loopDelay.disable();
    const cpu: { server: CpuReport | null; db: CpuReport | null } = { server: serverCpu?.stop() ?? null, db: dbCpu?.stop() ?? null };
    const machineLoad = machine.stop();
    const benchUsage = process.cpuUsage(benchCpuStart);
    const benchCpuPercent = ((benchUsage.user + benchUsage.system) / 1000 / (Date.now() - benchStart)) * 100;

    const latency = ledger.figures();
    const held = holds.figures();
    const traffic = trafficOf(desks.map((d) => d.counters), countersBefore);
    const applied = load.statuses.applied + load.statuses.superseded;
    const pairsExpected = [...consolesOf.values()].reduce((a, list) => a + list.length, 0) / Math.max(1, consolesOf.size) * applied;
    const finalHeld = desks.filter((d, i) => {
      const f = flights[i % flights.length];
      return d.held?.checkedIn === expectedCheckedIn(f);
    }).length;
    const counts = await verifyCounts(db, settings.appUrl, cookies[0], flights);
    const memoryAfter = serverPid ? memory(serverPid) : null;

    // After the load and its drain: the desk read at 50 connections against a constant route behind the same middleware.
    consoles.closeAll();
    const throughput = settings.throughputSeconds > 0 ? await compareThroughput(settings.appUrl, cookies[0], flights[0].id, settings.throughputSeconds) : null;

    const partial = {
      settings: { rate: settings.rate, seconds: settings.seconds, flights: flights.length, clients: consoles.sockets.length, sessions: cookies.length },
      load, latency, counts, throughput, browser,
      holds: held,
      perEvent: {
        requestsPerConsole: traffic.requests / pairsExpected,
        bytesPerConsole: (traffic.bytes + traffic.noticeBytes) / pairsExpected,
        serverCpuMs: (serverCpuSeconds * 1000) / Math.max(1, applied),
        sqlStatements: statements / Math.max(1, applied),
      },
      traffic: { ...traffic, consolesHoldingExactCount: finalHeld },
      server: { pid: serverPid, cpu: cpu.server, memoryBefore, memoryAfter },
      database: { pid: settings.dbPid ?? null, cpu: cpu.db },
      machine: machineLoad,
      bench: { cpuPercent: benchCpuPercent, eventLoopDelayP99Ms: loopDelay.percentile(99) / 1e6, disconnects: consoles.disconnects() },
    };
    const result: FeedBenchResult = { ...partial, goal: goalOf(partial) };
    printFigures(result);
    if (settings.resultFile) writeFileSync(settings.resultFile, JSON.stringify(result, null, 2));
  } finally {
    consoles?.closeAll();
    await db.destroy();
  }
}

try {
  await main();
  process.exit(0);
} catch (err) {
  console.error(`[feed-latency] ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
  process.exit(1);
}
