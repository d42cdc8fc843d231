import type { FakeStore } from '../store/store.js';
import type { IdempotencyRecord } from '../store/types.js';
import { StripeApiError } from './errors.js';

// Stripe: "Idempotency keys are up to 255 characters long" and may be pruned once at least 24 hours old
// (docs.stripe.com/api/idempotent_requests).
export const MAX_IDEMPOTENCY_KEY_LENGTH = 255;
export const DEFAULT_IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;

export type IdempotencyDecision =
  | { kind: 'fresh' }
  | { kind: 'replay'; record: IdempotencyRecord }
  | { kind: 'rejected'; error: StripeApiError };

/**
 * Stripe v1 idempotency: the first response for a key (once the endpoint starts executing) is saved and
 * replayed for later requests with that key; a different endpoint or different parameters is an
 * `idempotency_error`.
 *
 * No in-flight lock is needed: endpoints are synchronous (`Operation` returns a value, not a promise), so the
 * check, the work and the saved record happen in one turn of the event loop and same-key requests serialize.
 */
export class IdempotencyLayer {
  constructor(
    private readonly store: FakeStore,
    private readonly ttlMs: number,
    private readonly now: () => number,
  ) {}

  begin(key: string, method: string, path: string, fingerprint: string): IdempotencyDecision {
    if (key.length > MAX_IDEMPOTENCY_KEY_LENGTH) {
      return {
        kind: 'rejected',
        error: new StripeApiError(
          400,
          'invalid_request_error',
          `Idempotency-Key must be at most ${MAX_IDEMPOTENCY_KEY_LENGTH} characters long (got ${key.length}).`,
          'parameter_invalid',
        ),
      };
    }
    this.pruneExpired();
    const record = this.store.state.idempotency.get(key);
    if (record) {
      if (record.method !== method || record.path !== path) {
        return {
          kind: 'rejected',
          error: new StripeApiError(
            400,
            'idempotency_error',
            `Keys for idempotent requests can only be used for the same endpoint they were first used for ` +
              `('${record.method} ${record.path}' vs '${method} ${path}'). Try using a key other than '${key}' ` +
              `if you meant to execute a different request.`,
          ),
        };
      }
      if (record.fingerprint !== fingerprint) {
        return {
          kind: 'rejected',
          error: new StripeApiError(
            400,
            'idempotency_error',
            `Keys for idempotent requests can only be used with the same parameters they were first used with. ` +
              `Try using a key other than '${key}' if you meant to execute a different request.`,
          ),
        };
      }
      return { kind: 'replay', record };
    }
    return { kind: 'fresh' };
  }

  /** Call inside the store change that applied the request, so the saved response and its effects persist together. */
  save(record: Omit<IdempotencyRecord, 'createdAtMs'>): void {
    this.store.state.idempotency.set(record.key, { ...record, createdAtMs: this.now() });
  }

  private pruneExpired(): void {
    const cutoff = this.now() - this.ttlMs;
    const expired = [...this.store.state.idempotency.values()].filter((record) => record.createdAtMs <= cutoff);
    if (expired.length === 0) return;
    this.store.mutate((state) => {
      for (const record of expired) state.idempotency.delete(record.key);
    });
  }
}
