import { betaBinomialPmf, binomialPmf } from './binomial';
import type { BookingLimitOptimum, BookingLimitOptions, BookingLimitPoint, CommonShock } from './types';
import {
  probabilityOut,
  requireNonNegativeFinite,
  requireNonNegativeInteger,
  requireProbability,
  validateShock,
} from './validate';

/** The curve costs O(maxBookings^2) per scenario; this bound keeps one call to about a second at worst. */
export const MAX_BOOKINGS = 10_000;

interface TailFigures {
  pOversale: number;
  pFullOrOver: number;
  expectedDenied: number;
}

function tailFigures(pmf: Float64Array, capacity: number): TailFigures {
  let pOversale = 0;
  let expectedDenied = 0;
  for (let k = pmf.length - 1; k > capacity; k--) {
    pOversale += pmf[k];
    expectedDenied += (k - capacity) * pmf[k];
  }
  // X >= 0 always holds, so capacity 0 gives exactly 1 rather than the rounded sum of the pmf
  const pFullOrOver = capacity === 0 ? 1 : capacity < pmf.length ? pOversale + pmf[capacity] : 0;
  return { pOversale: probabilityOut(pOversale, 'pOversale'), pFullOrOver: probabilityOut(pFullOrOver, 'pFullOrOver'), expectedDenied };
}

/** Adds one more booking with show probability p: f'[k] = (1-p) f[k] + p f[k-1]. */
function addBooking(pmf: Float64Array, p: number): Float64Array {
  const next = new Float64Array(pmf.length + 1);
  next[0] = (1 - p) * pmf[0];
  for (let k = 1; k < pmf.length; k++) next[k] = (1 - p) * pmf[k] + p * pmf[k - 1];
  next[pmf.length] = p * pmf[pmf.length - 1];
  return next;
}

/**
 * Yields the tail figures of X_n for n = from, from + 1, ..., to. Binomial and scenario shocks step each
 * scenario's pmf one booking at a time; the beta-binomial is recomputed per n, since it has no such step.
 */
function* showUpTails(capacity: number, p: number, from: number, to: number, shock?: CommonShock) {
  if (shock?.kind === 'beta-binomial') {
    for (let n = from; n <= to; n++) yield tailFigures(betaBinomialPmf(n, p, shock.rho), capacity);
    return;
  }
  const scenarios = shock?.kind === 'scenarios' ? shock.scenarios : [{ weight: 1, probabilityFactor: 1 }];
  const weightSum = scenarios.reduce((sum, s) => sum + s.weight, 0);
  const parts = scenarios
    .filter((s) => s.weight > 0)
    .map((s) => {
      const scenarioP = Math.min(1, p * s.probabilityFactor);
      return { weight: s.weight / weightSum, p: scenarioP, pmf: binomialPmf(from, scenarioP) };
    });
  for (let n = from; n <= to; n++) {
    const mixed: TailFigures = { pOversale: 0, pFullOrOver: 0, expectedDenied: 0 };
    for (const part of parts) {
      const figures = tailFigures(part.pmf, capacity);
      mixed.pOversale += part.weight * figures.pOversale;
      mixed.pFullOrOver += part.weight * figures.pFullOrOver;
      mixed.expectedDenied += part.weight * figures.expectedDenied;
      if (n < to) part.pmf = addBooking(part.pmf, part.p);
    }
    yield { ...mixed, pOversale: probabilityOut(mixed.pOversale, 'pOversale'), pFullOrOver: probabilityOut(mixed.pFullOrOver, 'pFullOrOver') };
  }
}

function validateOptions(o: BookingLimitOptions): { maxBookings: number } {
  if (o === null || typeof o !== 'object') throw new RangeError('options must be an object');
  requireNonNegativeInteger(o.capacity, 'capacity');
  requireProbability(o.showProbability, 'showProbability');
  requireNonNegativeFinite(o.revenuePerBooking, 'revenuePerBooking');
  requireNonNegativeFinite(o.costPerDenial, 'costPerDenial');
  const maxBookings = o.maxBookings ?? 2 * o.capacity + 50;
  requireNonNegativeInteger(maxBookings, 'maxBookings');
  if (maxBookings < o.capacity) {
    throw new RangeError(`maxBookings must be at least capacity (${o.capacity}) (got ${maxBookings})`);
  }
  if (maxBookings > MAX_BOOKINGS) {
    throw new RangeError(`maxBookings must be at most ${MAX_BOOKINGS} (got ${maxBookings})`);
  }
  if (o.shock !== undefined) validateShock(o.shock);
  return { maxBookings };
}

function curveUpTo(o: BookingLimitOptions, to: number): BookingLimitPoint[] {
  const points: BookingLimitPoint[] = [];
  let n = o.capacity;
  for (const tails of showUpTails(o.capacity, o.showProbability, o.capacity, to, o.shock)) {
    points.push({
      bookings: n,
      expectedNet: o.revenuePerBooking * n - o.costPerDenial * tails.expectedDenied,
      pOversale: tails.pOversale,
      expectedDenied: tails.expectedDenied,
    });
    n++;
  }
  return points;
}

/**
 * Expected net revenue R(n) = r n - h E[(X_n - C)+] for n = capacity .. maxBookings, X_n the show-ups of n
 * bookings at show probability p (static overbooking model, Talluri & van Ryzin 2004 ch. 4; Rothstein 1971).
 */
export function bookingLimitCurve(o: BookingLimitOptions): BookingLimitPoint[] {
  const { maxBookings } = validateOptions(o);
  return curveUpTo(o, maxBookings);
}

/**
 * Booking limit that maximises R(n). Without a shock R(n+1) - R(n) = r - h p P(X_n >= C), which falls as n grows,
 * so n* = min{n >= C : h p P(X_n >= C) >= r} (at equality n and n+1 tie and the smaller is kept). A shock breaks
 * that marginal formula, so the curve is scanned for its argmax, ties going to the smallest n.
 */
export function optimalBookingLimit(o: BookingLimitOptions): BookingLimitOptimum {
  const { maxBookings } = validateOptions(o);
  const r = o.revenuePerBooking;
  const h = o.costPerDenial;
  if (o.shock === undefined) {
    let n = o.capacity;
    for (const tails of showUpTails(o.capacity, o.showProbability, o.capacity, maxBookings)) {
      const stop = h * o.showProbability * tails.pFullOrOver >= r;
      if (stop || n === maxBookings) {
        return { bookings: n, expectedNet: r * n - h * tails.expectedDenied, atSearchLimit: !stop };
      }
      n++;
    }
  }
  // one point past the limit tells whether the curve was still rising there
  const points = curveUpTo(o, maxBookings + 1);
  let best = points[0];
  for (let i = 1; i < points.length - 1; i++) if (points[i].expectedNet > best.expectedNet) best = points[i];
  const last = points[points.length - 1];
  return {
    bookings: best.bookings,
    expectedNet: best.expectedNet,
    atSearchLimit: best.bookings === maxBookings && last.expectedNet > best.expectedNet,
  };
}
