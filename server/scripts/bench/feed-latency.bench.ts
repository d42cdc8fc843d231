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
import { createStationKeys, ensureFlights, forecastComputedAt, loadBenchFlights } from './feed/fixture';
import { Ledger } from './feed/ledger';
import { createFeed, runLoad } from './feed/load';
import { memory, pidListeningOn, sampleCpu, sampleMachine, type CpuReport } from './feed/proc-stats';
import { goalOf, printFigures, type FeedBenchResult } from './feed/report';
import { readSettings } from './feed/settings';
import { verifyCounts } from './feed/verify';

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
    const flightIds = await ensureFlights(db, settings.flights);
    const flights = await loadBenchFlights(db, flightIds);
    const empty = flights.find((f) => f.passengers.length < 2);
    if (empty) throw new Error(`flight ${empty.carrier}${empty.number} has fewer than 2 passengers an event can move`);
    const keys = await createStationKeys(db, flights.map((f) => f.stationId));
    const cookies: string[] = [];
    for (let i = 0; i < settings.sessions; i++) cookies.push(await signIn(settings.appUrl, DEMO_AGENT.email, DEMO_PASSWORD));
    log(`${flights.length} flights (${flights.reduce((s, f) => s + f.passengers.length, 0)} passengers in play), ${cookies.length} sessions`);

    const ledger = new Ledger(flightIds, (id) => forecastComputedAt(db, id));
    let lastMessageAt = Date.now();
    consoles = await openConsoles({
      appUrl: settings.appUrl, cookies, flightIds, clients: settings.clients,
      onChanged: (client, flightId, at) => {
        lastMessageAt = at;
        ledger.received(client, flightId, at);
      },
    });
    log(`${consoles.sockets.length} consoles connected and watching`);
    // Start-up recomputes may still be reaching some consoles: start counting updates only once all is quiet.
    for (const until = Date.now() + 10_000; Date.now() - lastMessageAt < QUIET_MS && Date.now() < until; ) await sleep(50);
    await ledger.settle();
    ledger.reset();

    const serverPid = pidListeningOn(Number(new URL(settings.appUrl).port || 80), settings.serverPid);
    if (!serverPid) log('could not find the server process by its port: CPU and memory are not reported');
    const memoryBefore = serverPid ? memory(serverPid) : null;
    const serverCpu = serverPid ? sampleCpu(serverPid) : null;
    const dbCpu = settings.dbPid ? sampleCpu(settings.dbPid) : null;
    const machine = sampleMachine();
    const benchCpuStart = process.cpuUsage();
    const benchStart = Date.now();
    const loopDelay = monitorEventLoopDelay({ resolution: 10 });
    loopDelay.enable();

    log(`load: ${settings.rate} events/s for ${settings.seconds} s`);
    const load = await runLoad({
      appUrl: settings.appUrl, flights, keys, rate: settings.rate, seconds: settings.seconds, runId: settings.runId, ledger,
      onProgress: (sent, planned) => log(`${sent} / ${planned} events sent`),
    });

    // Re-announce one passenger per flight as they already stand (counts do not move): a last recompute covers events
    // whose POST answered after the previous recompute had started. These events are not measured.
    await sleep(200);
    const sweep = createFeed(settings.appUrl, keys, `${settings.runId}-sweep`);
    await Promise.all(flights.map((f) => sweep.post(f, f.passengers[0], f.passengers[0].checkedIn, Date.now())));
    for (const until = Date.now() + drainTimeoutMs(settings.seconds); Date.now() < until; ) {
      await ledger.settle();
      if (ledger.uncovered() === 0 && Date.now() - lastMessageAt >= QUIET_MS) break;
      await sleep(50);
    }
    await ledger.settle();
    loopDelay.disable();
    const cpu: { server: CpuReport | null; db: CpuReport | null } = { server: serverCpu?.stop() ?? null, db: dbCpu?.stop() ?? null };
    const machineLoad = machine.stop();
    const benchUsage = process.cpuUsage(benchCpuStart);
    const benchCpuPercent = ((benchUsage.user + benchUsage.system) / 1000 / (Date.now() - benchStart)) * 100;

    const latency = ledger.figures();
    const counts = await verifyCounts(db, settings.appUrl, cookies[0], flights);
    const memoryAfter = serverPid ? memory(serverPid) : null;

    const partial = {
      settings: { rate: settings.rate, seconds: settings.seconds, flights: flights.length, clients: consoles.sockets.length, sessions: cookies.length },
      load, latency, counts,
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
