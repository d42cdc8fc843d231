// Which provider failures may be retried with the same idempotency key and which are final. Stripe's error guide:
// connection problems, 5xx, 429 and 409 (a concurrent request with the same key) are worth retrying; other 4xx
// mean the request itself was refused and will be refused again.
import Stripe from 'stripe';

export interface ProviderFailure {
  retryable: boolean;
  /** One line for last_error and the ledger: what failed and, for a refusal, which parameter. */
  reason: string;
}

const REASON_MAX = 280;

export function classifyProviderError(error: unknown, step: string): ProviderFailure {
  if (error instanceof Stripe.errors.StripeError) {
    const status = error.statusCode;
    const retryable = status === undefined || status >= 500 || status === 429 || status === 409 || error.type === 'StripeConnectionError';
    const param = error.param ? ` (parameter ${error.param})` : '';
    const code = error.code ? ` [${error.code}]` : '';
    return { retryable, reason: clip(`${step}: ${status ?? 'no answer'}${code} ${error.message}${param}`) };
  }
  // Anything else (our database, a bug) is not the provider's refusal: try again later rather than give up on money owed.
  return { retryable: true, reason: clip(`${step}: ${(error as Error)?.message ?? String(error)}`) };
}

function clip(text: string): string {
  return text.length <= REASON_MAX ? text : `${text.slice(0, REASON_MAX - 1)}…`;
}
