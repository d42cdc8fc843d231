/**
 * Speed and accuracy of the show-up forecast engine on an 850-person flight (650 individuals with different show
 * probabilities, 60 pairs, 20 parties of four). Prints figures side by side; asserts nothing.
 * Run: npx tsx scripts/bench/forecast.bench.ts
 */
import { pathToFileURL } from 'node:url';
import {
  createSeededRandom,
  oversaleRisk,
  showUpDistribution,
  type CommonShock,
  type ShowUpUnit,
} from '../../../shared/forecast';

const CAPACITY = 690;
const FLIGHTS = 100_000;

function buildFlight(seed: number): ShowUpUnit[] {
  const random = createSeededRandom(seed);
  const units: ShowUpUnit[] = [];
  for (let i = 0; i < 650; i++) units.push({ size: 1, showProbability: 0.6 + 0.38 * random() });
  for (let i = 0; i < 60; i++) units.push({ size: 2, showProbability: 0.7 + 0.25 * random() });
  for (let i = 0; i < 20; i++) units.push({ size: 4, showProbability: 0.75 + 0.2 * random() });
  return units;
}

/** The textbook DP, one unit at a time over the full array: the baseline the engine is measured against. */
function plainDp(units: ShowUpUnit[]): Float64Array {
  const total = units.reduce((s, u) => s + u.size * (u.count ?? 1), 0);
  const f = new Float64Array(total + 1);
  f[0] = 1;
  for (const u of units) {
    for (let c = 0; c < (u.count ?? 1); c++) {
      const p = u.showProbability;
      for (let k = total; k >= u.size; k--) f[k] = (1 - p) * f[k] + p * f[k - u.size];
      for (let k = u.size - 1; k >= 0; k--) f[k] *= 1 - p;
    }
  }
  return f;
}

/** The spreadsheet approach: simulate each flight passenger by passenger and count oversold departures. */
function monteCarloOversale(units: ShowUpUnit[], flights: number, seed: number): number {
  const random = createSeededRandom(seed);
  let oversold = 0;
  for (let flight = 0; flight < flights; flight++) {
    let shows = 0;
    for (const u of units) if (random() < u.showProbability) shows += u.size;
    if (shows > CAPACITY) oversold++;
  }
  return oversold / flights;
}

function medianMs(repetitions: number, run: () => unknown): number {
  const times: number[] = [];
  for (let i = 0; i < repetitions; i++) {
    const start = performance.now();
    run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

const FIVE_SCENARIOS: CommonShock = {
  kind: 'scenarios',
  scenarios: [
    { weight: 0.1, probabilityFactor: 0.9 },
    { weight: 0.2, probabilityFactor: 0.95 },
    { weight: 0.4, probabilityFactor: 1 },
    { weight: 0.2, probabilityFactor: 1.05 },
    { weight: 0.1, probabilityFactor: 1.1 },
  ],
};

export async function runForecastBench(): Promise<Record<string, string | number>> {
  const units = buildFlight(20_240_611);
  const people = units.reduce((s, u) => s + u.size, 0);
  for (let i = 0; i < 5; i++) {
    showUpDistribution(units);
    plainDp(units);
  }
  const engineMs = medianMs(31, () => showUpDistribution(units));
  const plainMs = medianMs(31, () => plainDp(units));
  const scenariosMs = medianMs(11, () => showUpDistribution(units, FIVE_SCENARIOS));
  const betaMs = medianMs(5, () => showUpDistribution(units, { kind: 'beta-binomial', rho: 0.02 }));

  const exact = oversaleRisk(showUpDistribution(units), CAPACITY).pOversale;
  const plainValue = oversaleRisk(plainDp(units), CAPACITY).pOversale;
  let estimate = 0;
  const monteCarloMs = medianMs(3, () => (estimate = monteCarloOversale(units, FLIGHTS, 7)));
  const standardError = Math.sqrt((exact * (1 - exact)) / FLIGHTS);

  return {
    people,
    units: units.length,
    capacity: CAPACITY,
    'engine showUpDistribution ms (median of 31)': round(engineMs),
    'plain Float64Array DP ms (median of 31)': round(plainMs),
    'engine / plain (target <= 2)': round(engineMs / plainMs),
    'five-scenario shock ms (median of 11)': round(scenariosMs),
    'five-scenario / engine (target about <= 5)': round(scenariosMs / engineMs),
    'beta-binomial shock rho 0.02 ms (median of 5)': round(betaMs),
    'exact P(X > C)': exact.toPrecision(12),
    'plain DP P(X > C), |difference|': Math.abs(plainValue - exact).toExponential(2),
    [`Monte Carlo ${FLIGHTS} flights ms (median of 3)`]: round(monteCarloMs),
    'Monte Carlo / engine time': round(monteCarloMs / engineMs),
    'Monte Carlo P(X > C)': estimate.toPrecision(6),
    'Monte Carlo |error|': Math.abs(estimate - exact).toExponential(2),
    'Monte Carlo standard error sqrt(p(1-p)/N)': standardError.toExponential(2),
  };
}

function round(value: number): number {
  return Math.round(value * 1000) / 1000;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const figures = await runForecastBench();
  const width = Math.max(...Object.keys(figures).map((k) => k.length));
  for (const [name, value] of Object.entries(figures)) console.log(`${name.padEnd(width)}  ${value}`);
}
