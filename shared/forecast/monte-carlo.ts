import { betaShape } from './binomial';
import { groupUnits } from './poisson-binomial';
import { betaRateTransform, scenarioTransform } from './shock';
import type { CommonShock, ShowUpUnit } from './types';
import { requirePositiveInteger, validateShock } from './validate';

/**
 * Seeded uniform generator on [0, 1): sfc32 (Chris Doty-Humphrey's small fast counting generator, which passes
 * PractRand), its state filled from the seed by splitmix32. Reproducible simulations for tests and benchmarks.
 */
export function createSeededRandom(seed: number): () => number {
  let mix = seed >>> 0;
  const splitmix32 = (): number => {
    mix = (mix + 0x9e3779b9) >>> 0;
    let z = mix;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
    return (z ^ (z >>> 16)) >>> 0;
  };
  let a = splitmix32();
  let b = splitmix32();
  let c = splitmix32();
  let counter = 1;
  const next = (): number => {
    const t = (((a + b) >>> 0) + counter) >>> 0;
    counter = (counter + 1) >>> 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) >>> 0;
    c = ((c << 21) | (c >>> 11)) >>> 0;
    c = (c + t) >>> 0;
    return t;
  };
  for (let i = 0; i < 12; i++) next();
  return () => next() / 4294967296;
}

function standardNormal(random: () => number): number {
  // Box-Muller; 1 - u keeps the logarithm away from 0
  return Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

/** Gamma(shape, 1) by Marsaglia and Tsang (2000); shapes below 1 use the U^(1/shape) boost. */
function gammaSample(shape: number, random: () => number): number {
  if (shape < 1) return gammaSample(shape + 1, random) * Math.pow(1 - random(), 1 / shape);
  const d = shape - 1 / 3;
  const c = 1 / Math.sqrt(9 * d);
  for (;;) {
    const x = standardNormal(random);
    const v = Math.pow(1 + c * x, 3);
    if (v <= 0) continue;
    const u = 1 - random();
    if (Math.log(u) < 0.5 * x * x + d - d * v + d * Math.log(v)) return d * v;
  }
}

export function betaSample(a: number, b: number, random: () => number): number {
  const x = gammaSample(a, random);
  return x / (x + gammaSample(b, random));
}

/**
 * Empirical show-up pmf from simulating `flights` departures, unit by unit (the spreadsheet approach), with the
 * same shock model as showUpDistribution. Used to cross-check the exact engine and to time the alternative.
 */
export function simulateShowUps(
  units: ShowUpUnit[],
  flights: number,
  seed: number,
  shock?: CommonShock,
): Float64Array {
  const { groups, total } = groupUnits(units);
  requirePositiveInteger(flights, 'flights');
  if (shock !== undefined) validateShock(shock);
  const random = createSeededRandom(seed);
  const mean = total === 0 ? 0 : groups.reduce((s, g) => s + g.size * g.count * g.probability, 0) / total;
  const shape = shock?.kind === 'beta-binomial' && mean > 0 && mean < 1 ? betaShape(mean, shock.rho) : undefined;
  const counts = new Float64Array(total + 1);
  const probabilities = new Float64Array(groups.length);
  for (let flight = 0; flight < flights; flight++) {
    let transform = (p: number): number => p;
    if (shape) transform = betaRateTransform(betaSample(shape.a, shape.b, random), mean);
    else if (shock?.kind === 'scenarios') transform = scenarioTransform(pickScenario(shock.scenarios, random()));
    groups.forEach((g, i) => (probabilities[i] = transform(g.probability)));
    let shows = 0;
    for (let i = 0; i < groups.length; i++) {
      for (let c = 0; c < groups[i].count; c++) if (random() < probabilities[i]) shows += groups[i].size;
    }
    counts[shows]++;
  }
  for (let k = 0; k <= total; k++) counts[k] /= flights;
  return counts;
}

function pickScenario(scenarios: { weight: number; probabilityFactor: number }[], u: number): number {
  let cumulative = 0;
  for (const s of scenarios) {
    cumulative += s.weight;
    if (u < cumulative) return s.probabilityFactor;
  }
  return scenarios[scenarios.length - 1].probabilityFactor;
}
