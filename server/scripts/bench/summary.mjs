// The short table `npm run bench` ends with: one line per step, and the feed-latency figures that matter.

const ms = (v) => (Number.isFinite(v) ? `${Math.round(v)} ms` : 'n/a');
const pct = (c) => (c ? `${c.averagePercent.toFixed(0)} % avg, ${c.peakPercent.toFixed(0)} % peak` : 'n/a');
const mib = (m, key) => (m ? `${m[key].toFixed(0)} MiB` : 'n/a');

/** Machine CPU not used by the server, MariaDB or the bench process. */
const others = (r) => Math.max(0, r.machine.busyPercent - (r.server.cpu?.averagePercent ?? 0) - (r.database.cpu?.averagePercent ?? 0) - r.bench.cpuPercent);

function feedLines(r) {
  const s = r.load.statuses;
  const lost = r.latency.eventsNeverCovered + s.rejected + s.failed;
  return [
    `${r.settings.rate}/s x ${r.settings.seconds} s, ${r.settings.flights} flights, ${r.settings.clients} consoles`,
    `POST -> console holds the data p50 ${ms(r.holds.pairs.p50)}, p95 ${ms(r.holds.pairs.p95)}, p99 ${ms(r.holds.pairs.p99)} (goal < ${r.goal.p99UnderMs} ms: ${r.goal.latencyMet ? 'met' : 'NOT met'}), max ${ms(r.holds.pairs.max)}`,
    `per event: ${r.perEvent.serverCpuMs.toFixed(2)} ms server CPU (goal <= 1.5), ${r.perEvent.sqlStatements.toFixed(1)} SQL statements (goal <= 4), ${r.perEvent.requestsPerConsole.toFixed(2)} requests and ${Math.round(r.perEvent.bytesPerConsole)} B per console (goal <= 2048 B)`,
    ...(r.browser ? [`browser on the desk: POST -> count in the DOM p50 ${ms(r.browser.p50)}, max ${ms(r.browser.max)} (${r.browser.samples.length} samples)`] : []),
    ...(r.throughput ? [`desk GET ${Math.round(r.throughput.desk.requestsPerSecond)} req/s vs ${Math.round(r.throughput.reference.requestsPerSecond)} req/s for a constant route behind the same middleware: ${r.throughput.ratio.toFixed(2)} (goal >= 0.5)`] : []),
    `events ${r.load.sent} sent, ${s.applied + s.superseded} applied, ${lost} lost; counts exact on ${Math.min(r.counts.exactStored, r.counts.exactShown)}/${r.settings.flights} flights (${r.goal.nothingLost ? 'nothing lost' : 'SOMETHING LOST'})`,
    `server CPU ${pct(r.server.cpu)} of one core; RSS ${mib(r.server.memoryAfter, 'rssMiB')}, peak ${mib(r.server.memoryAfter, 'peakRssMiB')}; MariaDB CPU ${pct(r.database.cpu)}`,
    `whole machine ${r.machine.busyPercent.toFixed(0)} % busy of ${r.machine.cores * 100} %, ${others(r).toFixed(0)} % of it by other processes${others(r) > 25 ? ' (figures disturbed: rerun on a quiet machine)' : ''}`,
  ];
}

export function printSummary(steps) {
  const width = Math.max(...steps.map((s) => s.name.length));
  const pad = ' '.repeat(width + 22);
  console.log('\n  Bumpboard bench summary');
  for (const s of steps) {
    const details = typeof s.detail === 'object' && s.detail ? feedLines(s.detail) : [s.detail].filter(Boolean);
    console.log(`    ${s.ok ? 'ran ' : 'FAIL'}  ${s.name.padEnd(width)}  ${`${s.seconds.toFixed(1)} s`.padStart(8)}  ${details[0] ?? ''}`);
    for (const line of details.slice(1)) console.log(`${pad}${line}`);
  }
  console.log('');
}
