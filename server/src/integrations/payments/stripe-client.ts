// The one place the Stripe SDK is configured. Pointing it at the local stand-in instead of Stripe is configuration
// only: host, port and protocol come from STRIPE_API_URL, and everything else is the same code path.
import { createHash } from 'node:crypto';
import Stripe from 'stripe';

export interface StripeClientConfig {
  secretKey: string;
  /** Empty: the real Stripe API. Otherwise a base URL such as http://127.0.0.1:4602. */
  apiUrl: string;
  /**
   * Per-request timeout. The SDK's own default (80 s) is far longer than a gate agent should wait; a timeout is
   * retried with the same idempotency key, so a short one costs nothing but a retry.
   */
  timeoutMs?: number;
  maxNetworkRetries?: number;
}

/** Two retries with the SDK's backoff, as Stripe's idempotent-requests guide suggests for network failures. */
const DEFAULT_RETRIES = 2;
const DEFAULT_TIMEOUT_MS = 20_000;

/**
 * A short fingerprint of the provider account this configuration talks to (API URL and key), never the key
 * itself. Issuances remember it, so only a server configured for the same account resumes them.
 */
export function providerAccountOf(config: Pick<StripeClientConfig, 'apiUrl' | 'secretKey'>): string {
  return createHash('sha256').update(`${config.apiUrl || 'https://api.stripe.com'}|${config.secretKey}`).digest('hex').slice(0, 16);
}

export function createStripeClient(config: StripeClientConfig): Stripe {
  const common = {
    maxNetworkRetries: config.maxNetworkRetries ?? DEFAULT_RETRIES,
    telemetry: false,
    timeout: config.timeoutMs ?? DEFAULT_TIMEOUT_MS,
  };
  if (!config.apiUrl) return new Stripe(config.secretKey, common);
  const url = new URL(config.apiUrl);
  if (url.protocol !== 'http:' && url.protocol !== 'https:') {
    throw new Error(`STRIPE_API_URL must be an http or https URL (got ${config.apiUrl}).`);
  }
  const protocol = url.protocol === 'https:' ? 'https' : 'http';
  const port = url.port ? Number(url.port) : protocol === 'https' ? 443 : 80;
  return new Stripe(config.secretKey, { ...common, host: url.hostname, port, protocol });
}
