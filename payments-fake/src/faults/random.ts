/** Returns numbers in [0, 1). */
export type RandomSource = () => number;

/** mulberry32: a tiny seeded generator, so a fault schedule given a seed repeats exactly. */
export function seededRandom(seed: number): RandomSource {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function randomSource(seed: number | undefined): RandomSource {
  return seed === undefined ? Math.random : seededRandom(seed);
}

/**
 * Shared trigger logic for fault rules: fire the next `count` times, or with `probability`
 * (bounded by `count` when both are given). With neither, the rule fires once.
 */
export interface TriggerSpec {
  count?: number;
  probability?: number;
  seed?: number;
}

export class Trigger {
  private remaining: number | null;
  private readonly probability: number | null;
  private readonly random: RandomSource;

  constructor(spec: TriggerSpec) {
    this.probability = spec.probability ?? null;
    this.remaining = spec.count ?? (this.probability === null ? 1 : null);
    this.random = randomSource(spec.seed);
  }

  /** Decides for one occurrence and consumes a count when it fires. */
  fire(): boolean {
    if (this.remaining !== null && this.remaining <= 0) return false;
    if (this.probability !== null && !(this.random() < this.probability)) return false;
    if (this.remaining !== null) this.remaining -= 1;
    return true;
  }

  get exhausted(): boolean {
    return this.remaining !== null && this.remaining <= 0;
  }

  describe(): { remaining: number | null; probability: number | null } {
    return { remaining: this.remaining, probability: this.probability };
  }
}
