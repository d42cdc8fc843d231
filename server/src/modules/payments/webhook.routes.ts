// POST /api/payments/webhook: the provider's signed events. Mounted before any JSON parser and outside the session
// and CSRF middleware, because the signature covers the raw bytes exactly as sent (Stripe docs, "Verify webhook
// signatures": constructEvent needs the raw request body).
import express, { Router } from 'express';
import { badRequest } from '../../http/errors';
import type { PaymentsContext } from './payments-context';
import { receiveProviderEvent } from './webhook.service';

export function paymentsWebhookRouter(ctx: PaymentsContext) {
  const r = Router();
  r.post('/', express.raw({ type: 'application/json', limit: '1mb' }), async (req, res) => {
    const raw = Buffer.isBuffer(req.body) ? req.body : null;
    if (!raw) throw badRequest('body: must be the provider’s JSON event, sent as application/json', [{ field: 'body', rule: 'must be a JSON event with Content-Type application/json' }]);
    let event;
    try {
      event = ctx.provider.verifyWebhook(raw, req.get('stripe-signature'));
    } catch (error) {
      // Unsigned, wrongly signed or older than the tolerance: refused, and nothing about it is stored.
      // The library's own sentence goes to the log only (as the error's cause); the client reads our rule.
      const rule = 'must be a valid signature of this body, made within the last 300 seconds';
      throw badRequest(`Stripe-Signature: ${rule}`, [{ field: 'Stripe-Signature', rule }], error);
    }
    const result = await receiveProviderEvent(ctx, event);
    res.json(result.duplicate ? { received: true, duplicate: true } : { received: true, outcome: result.outcome });
  });
  return r;
}
