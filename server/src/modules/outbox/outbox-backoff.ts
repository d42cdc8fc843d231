// How long a message waits after a transient failure before the next try.

export interface BackoffPolicy {
  baseMs: number;
  maxMs: number;
}

/** 1 s, 2 s, 4 s … capped at 60 s: a short outage clears in seconds, a long one costs one try a minute. */
export const DEFAULT_BACKOFF: BackoffPolicy = { baseMs: 1_000, maxMs: 60_000 };

/** Twelve tries span about six minutes with the default policy; after that a person decides (the retry route). */
export const DEFAULT_MAX_ATTEMPTS = 12;

/** The wait after the given failed attempt (1 for the first send). */
export function retryDelayMs(failedAttempt: number, policy: BackoffPolicy = DEFAULT_BACKOFF): number {
  if (!Number.isInteger(failedAttempt) || failedAttempt < 1) throw new RangeError(`failedAttempt: must be a whole number of at least 1, got ${failedAttempt}`);
  // Capping the exponent first keeps 2 ** n finite for any attempt count.
  const exponent = Math.min(failedAttempt - 1, 30);
  return Math.min(policy.maxMs, policy.baseMs * 2 ** exponent);
}
