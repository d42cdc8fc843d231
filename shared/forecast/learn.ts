import { requireNonNegativeInteger } from './validate';

/** One segment's closed-flight record: how many bookings it had and how many of them showed. */
export interface SegmentHistory {
  /** From the widest level to the narrowest, e.g. [station, route, fareClass, checkInState]. */
  segment: string[];
  booked: number;
  showed: number;
}

export interface LearnedRate {
  /** Estimated show probability of the segment. */
  rate: number;
  /** Bookings the segment itself was seen with. */
  evidence: number;
  /** The parent level whose rate this one leans on; null when it leans on none (the carrier level itself). */
  shrunkToward: string | null;
}

export interface LearnOptions {
  /** Bookings a segment needs before its own record counts at all; below it, it takes its parent's rate. */
  minEvidence?: number;
}

/** Default minimum evidence: a segment below 30 bookings takes its parent's rate (common practice, no source). */
export const DEFAULT_MIN_EVIDENCE = 30;

/**
 * The prior strength used when a level's segments spread no more than chance would make them (the estimated
 * between-segment variance is zero): large enough that small segments follow the parent, finite so that a segment
 * with far more bookings than this still stands on its own record.
 */
export const MAX_PRIOR_STRENGTH = 5_000;

/** Key of the carrier level: the empty segment joined by '/'. */
export const CARRIER_LEVEL = '';

interface Node {
  key: string;
  parent: string | null;
  depth: number;
  booked: number;
  showed: number;
}

/** Totals of every prefix of every segment, the carrier level (depth 0) included. */
function aggregate(history: SegmentHistory[]): Map<string, Node> {
  const nodes = new Map<string, Node>();
  const add = (key: string, parent: string | null, depth: number, booked: number, showed: number) => {
    const node = nodes.get(key) ?? { key, parent, depth, booked: 0, showed: 0 };
    node.booked += booked;
    node.showed += showed;
    nodes.set(key, node);
  };
  history.forEach((row, i) => {
    requireNonNegativeInteger(row.booked, `history[${i}].booked`);
    requireNonNegativeInteger(row.showed, `history[${i}].showed`);
    if (row.showed > row.booked) throw new RangeError(`history[${i}].showed must not exceed booked (${row.showed} > ${row.booked})`);
    if (row.segment.length === 0) throw new RangeError(`history[${i}].segment must name at least one level`);
    if (row.segment.some((part) => part.includes('/'))) throw new RangeError(`history[${i}].segment parts must not contain '/'`);
    add(CARRIER_LEVEL, null, 0, row.booked, row.showed);
    for (let d = 1; d <= row.segment.length; d++) {
      const key = row.segment.slice(0, d).join('/');
      add(key, d === 1 ? CARRIER_LEVEL : row.segment.slice(0, d - 1).join('/'), d, row.booked, row.showed);
    }
  });
  return nodes;
}

/**
 * Method-of-moments estimate of the beta-binomial intra-class correlation rho among the children of each parent at
 * one depth, pooled over all parents of that depth (Kleinman's weighted moment estimator, from memory). For parent g
 * with pooled rate mu and children of n_i bookings, y_i shows:
 *   S_g = sum n_i (y_i/n_i - mu)^2,  E[S_g] = mu(1-mu) [(k-1) + rho (N - sum n_i^2 / N)]
 * so rho = sum_g (S_g - (k_g-1) mu(1-mu)) / sum_g mu(1-mu)(N_g - sum n_i^2/N_g), clamped to [0, 1]. The prior of a
 * child is then Beta(m mu, m (1-mu)) with strength m = 1/rho - 1 bookings.
 */
export function priorStrength(groups: Array<Array<{ booked: number; showed: number }>>): number {
  let numerator = 0;
  let denominator = 0;
  for (const children of groups) {
    const seen = children.filter((c) => c.booked > 0);
    if (seen.length < 2) continue;
    const total = seen.reduce((s, c) => s + c.booked, 0);
    const mu = seen.reduce((s, c) => s + c.showed, 0) / total;
    const spread = mu * (1 - mu);
    if (spread === 0) continue;
    const s = seen.reduce((acc, c) => acc + c.booked * (c.showed / c.booked - mu) ** 2, 0);
    numerator += s - (seen.length - 1) * spread;
    denominator += spread * (total - seen.reduce((acc, c) => acc + c.booked * c.booked, 0) / total);
  }
  if (denominator <= 0) return MAX_PRIOR_STRENGTH;
  const rho = Math.min(1, Math.max(0, numerator / denominator));
  if (rho === 0) return MAX_PRIOR_STRENGTH;
  return Math.min(MAX_PRIOR_STRENGTH, 1 / rho - 1);
}

/**
 * Show probability per segment and per every wider level, by hierarchical empirical Bayes on the beta-binomial
 * model: each level's rate is the posterior mean (showed + m * parentRate) / (booked + m) under a Beta prior centred
 * on the parent's own (already shrunk) rate, with the prior strength m of that depth estimated from the data by the
 * method of moments (`priorStrength`). A segment with fewer than `minEvidence` bookings does not stand on its own: it
 * takes its parent's rate. The carrier level (key '') is the plain pooled rate. Keys are the segments joined by '/'.
 */
export function learnShowRates(history: SegmentHistory[], options?: LearnOptions): Map<string, LearnedRate> {
  const minEvidence = options?.minEvidence ?? DEFAULT_MIN_EVIDENCE;
  if (!(minEvidence >= 0 && Number.isFinite(minEvidence))) throw new RangeError(`minEvidence must be a finite number >= 0 (got ${String(minEvidence)})`);
  const nodes = aggregate(history);
  const out = new Map<string, LearnedRate>();
  const root = nodes.get(CARRIER_LEVEL);
  if (!root || root.booked === 0) return out;
  out.set(CARRIER_LEVEL, { rate: root.showed / root.booked, evidence: root.booked, shrunkToward: null });

  const maxDepth = Math.max(...[...nodes.values()].map((n) => n.depth));
  for (let depth = 1; depth <= maxDepth; depth++) {
    const level = [...nodes.values()].filter((n) => n.depth === depth);
    const byParent = new Map<string, Node[]>();
    for (const n of level) byParent.set(n.parent ?? CARRIER_LEVEL, [...(byParent.get(n.parent ?? CARRIER_LEVEL) ?? []), n]);
    const m = priorStrength([...byParent.values()]);
    for (const n of level) {
      const parentKey = n.parent ?? CARRIER_LEVEL;
      const parentRate = out.get(parentKey)!.rate;
      const rate = n.booked < minEvidence || n.booked === 0 ? parentRate : (n.showed + m * parentRate) / (n.booked + m);
      out.set(n.key, { rate, evidence: n.booked, shrunkToward: parentKey });
    }
  }
  return out;
}

/** The learned rate for a segment, or of its nearest wider level that was learned; null when nothing was. */
export function lookupRate(rates: Map<string, LearnedRate>, segment: string[]): LearnedRate | null {
  for (let d = segment.length; d >= 0; d--) {
    const hit = rates.get(segment.slice(0, d).join('/'));
    if (hit) return hit;
  }
  return null;
}
