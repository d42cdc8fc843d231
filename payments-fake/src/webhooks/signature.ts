import { createHmac } from 'node:crypto';

/**
 * Stripe's webhook signature scheme: `t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<payload>" keyed by the
 * endpoint secret>`. The SDK's `webhooks.constructEvent` checks exactly this and rejects timestamps older than 300 s,
 * so every attempt is signed afresh.
 */
export function signPayload(payload: string, secret: string, timestampSeconds: number): string {
  const signature = createHmac('sha256', secret).update(`${timestampSeconds}.${payload}`, 'utf8').digest('hex');
  return `t=${timestampSeconds},v1=${signature}`;
}
