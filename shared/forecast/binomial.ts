import { requireNonNegativeInteger, requireOpenUnitInterval, requireProbability } from './validate';

/**
 * Builds a pmf on 0..n from the term ratios f(k+1)/f(k). Starting at 1 on the largest term and walking outwards
 * keeps every intermediate value <= 1 (no overflow) and lets only the far tails underflow; dividing by the sum at the
 * end restores the scale, since the exact terms sum to 1. Each step costs a few roundings, so the relative error
 * stays near n * 1e-16 even where the values are tiny, unlike 1 - cdf or a product of factorials.
 */
function pmfFromRatios(n: number, peak: number, up: (k: number) => number, down: (k: number) => number): Float64Array {
  const pmf = new Float64Array(n + 1);
  pmf[peak] = 1;
  for (let k = peak; k < n; k++) pmf[k + 1] = pmf[k] * up(k);
  for (let k = peak; k > 0; k--) pmf[k - 1] = pmf[k] * down(k);
  let sum = 0;
  for (let k = 0; k <= n; k++) sum += pmf[k];
  for (let k = 0; k <= n; k++) pmf[k] /= sum;
  return pmf;
}

function pointMass(n: number, at: number): Float64Array {
  const pmf = new Float64Array(n + 1);
  pmf[at] = 1;
  return pmf;
}

/** Binomial(n, p) pmf over 0..n by the ratio f(k+1)/f(k) = (n-k)p / ((k+1)(1-p)), started at the mode. */
export function binomialPmf(n: number, p: number): Float64Array {
  requireNonNegativeInteger(n, 'n');
  requireProbability(p, 'p');
  if (p === 0) return pointMass(n, 0);
  if (p === 1) return pointMass(n, n);
  const q = 1 - p;
  const mode = Math.min(n, Math.floor((n + 1) * p));
  return pmfFromRatios(
    n,
    mode,
    (k) => ((n - k) * p) / ((k + 1) * q),
    (k) => (k * q) / ((n - k + 1) * p),
  );
}

/** Beta shape parameters with the given mean and intra-class correlation rho = 1 / (a + b + 1). */
export function betaShape(mean: number, rho: number): { a: number; b: number } {
  const scale = 1 / rho - 1;
  return { a: mean * scale, b: (1 - mean) * scale };
}

/**
 * Beta-binomial pmf: the show rate is drawn once per flight from a Beta with the given mean and intra-class
 * correlation rho, then each of n people shows independently at that rate.
 * P(X=k) = C(n,k) B(k+a, n-k+b) / B(a,b), computed from the ratio
 * f(k+1)/f(k) = (n-k)(k+a) / ((k+1)(n-k-1+b)), so no gamma function or factorial is evaluated.
 * Variance n m (1-m) [1 + (n-1) rho].
 */
export function betaBinomialPmf(n: number, mean: number, rho: number): Float64Array {
  requireNonNegativeInteger(n, 'n');
  requireProbability(mean, 'mean');
  requireOpenUnitInterval(rho, 'rho');
  if (mean === 0) return pointMass(n, 0);
  if (mean === 1) return pointMass(n, n);
  const { a, b } = betaShape(mean, rho);
  const up = (k: number): number => ((n - k) * (k + a)) / ((k + 1) * (n - k - 1 + b));
  // The pmf may be U-shaped when a < 1 and b < 1, so the global peak is found on the log scale rather than by a
  // mode formula; its exact position only matters for keeping values <= 1.
  let logValue = 0;
  let bestLog = 0;
  let peak = 0;
  for (let k = 0; k < n; k++) {
    logValue += Math.log(up(k));
    if (logValue > bestLog) {
      bestLog = logValue;
      peak = k + 1;
    }
  }
  return pmfFromRatios(n, peak, up, (k) => (k * (n - k + b)) / ((n - k + 1) * (k - 1 + a)));
}
