import express, { Router, type ErrorRequestHandler, type RequestHandler, type Response } from 'express';
import type { z } from 'zod';
import { StripeApiError } from '../http/errors.js';
import type { ApiFaults } from '../faults/apiFaults.js';
import type { WebhookFaults } from '../faults/webhookFaults.js';
import type { ResourceDeps } from '../resources/context.js';
import { settleCard } from '../resources/transactions.js';
import type { WebhookDispatcher } from '../webhooks/dispatcher.js';
import { apiFaultSchema, describeIssue, endpointSchema, settleSchema, webhookFaultSchema } from './schemas.js';
import { summarize } from './summary.js';

export interface ControlDeps extends ResourceDeps {
  apiFaults: ApiFaults;
  webhookFaults: WebhookFaults;
  webhooks: WebhookDispatcher;
  reset: () => void;
}

const LOOPBACK = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);

/** The control API needs no key, so it must only ever answer the local machine. */
const loopbackOnly: RequestHandler = (req, res, next) => {
  if (LOOPBACK.has(req.socket.remoteAddress ?? '')) return next();
  res.status(403).json({ error: { type: 'invalid_request_error', message: 'The control API answers loopback clients only.' } });
};

function fail(res: Response, status: number, message: string, param?: string): void {
  res.status(status).json({ error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) } });
}

function parse<T>(schema: z.ZodType<T>, body: unknown, res: Response): T | null {
  const result = schema.safeParse(body ?? {});
  if (result.success) return result.data;
  const { message, param } = describeIssue(result.error);
  fail(res, 400, message, param);
  return null;
}

export function controlRouter(deps: ControlDeps): Router {
  const router = Router();
  router.use(loopbackOnly, express.json({ limit: '64kb' }));

  router.get('/summary', (_req, res) => {
    res.json(summarize(deps));
  });
  router.post('/reset', (_req, res) => {
    deps.reset();
    res.json(summarize(deps));
  });

  router.get('/faults', (_req, res) => {
    res.json({ data: deps.apiFaults.list() });
  });
  router.post('/faults', (req, res) => {
    const spec = parse(apiFaultSchema, req.body, res);
    if (spec) res.json(deps.apiFaults.add(spec));
  });
  router.delete('/faults', (_req, res) => {
    deps.apiFaults.clear();
    res.json({ data: [] });
  });

  router.get('/webhooks/endpoint', (_req, res) => {
    const endpoint = deps.webhooks.endpoint();
    res.json({ url: endpoint?.url ?? null, secretSet: Boolean(endpoint?.secret) });
  });
  router.post('/webhooks/endpoint', (req, res) => {
    const endpoint = parse(endpointSchema, req.body, res);
    if (!endpoint) return;
    deps.webhooks.setEndpoint(endpoint);
    res.json({ url: endpoint.url, secretSet: true });
  });
  router.get('/webhooks/deliveries', (_req, res) => {
    res.json({ data: deps.webhooks.deliveries().map(({ secret: _secret, payload: _payload, ...rest }) => rest) });
  });
  router.post('/webhooks/flush', (_req, res) => {
    deps.webhooks.flush();
    res.json({ ok: true });
  });
  router.get('/webhooks/faults', (_req, res) => {
    res.json({ data: deps.webhookFaults.list() });
  });
  router.post('/webhooks/faults', (req, res) => {
    const spec = parse(webhookFaultSchema, req.body, res);
    if (spec) res.json(deps.webhookFaults.add(spec));
  });
  router.delete('/webhooks/faults', (_req, res) => {
    deps.webhookFaults.clear();
    res.json({ data: [] });
  });

  router.post('/issuing/cards/:id/settle', (req, res) => {
    const body = parse(settleSchema, req.body, res);
    if (!body) return;
    try {
      res.json(settleCard(deps, req.params.id, { amount: body.amount, merchantName: body.merchant_name }));
    } catch (error) {
      if (!(error instanceof StripeApiError)) throw error;
      res.status(error.status).json(error.toBody());
    }
  });

  router.use((req, res) => fail(res, 404, `Unknown control route ${req.method} ${req.baseUrl}${req.path}.`));
  const jsonErrors: ErrorRequestHandler = (error: unknown, _req, res, _next) => {
    void _next;
    const status = (error as { status?: number }).status;
    if (status && status >= 400 && status < 500) return fail(res, status, `Could not read the JSON body: ${(error as Error).message}`);
    console.error('payments-fake: control API failed', error);
    fail(res, 500, 'The control API failed; see the stand-in log.');
  };
  router.use(jsonErrors);
  return router;
}
