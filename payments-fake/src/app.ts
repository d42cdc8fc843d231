import express, { Router, type Express } from 'express';
import { ApiFaults } from './faults/apiFaults.js';
import { Holds } from './faults/holds.js';
import { WebhookFaults } from './faults/webhookFaults.js';
import { DEFAULT_IDEMPOTENCY_TTL_MS, IdempotencyLayer } from './http/idempotency.js';
import { apiErrorHandler, authenticate, faultsBefore, requestContext, requireFormBody, unknownRoute } from './http/pipeline.js';
import type { RunnerDeps } from './http/runner.js';
import { controlRouter } from './control/controlRouter.js';
import { renderPage } from './page/page.js';
import { cardholdersRouter } from './resources/cardholders.js';
import { cardsRouter } from './resources/cards.js';
import type { ResourceDeps } from './resources/context.js';
import { EventLog } from './resources/eventLog.js';
import { eventsRouter } from './resources/events.js';
import { ephemeralKeysRouter } from './resources/ephemeralKeys.js';
import { outboundPaymentHelpersRouter, outboundPaymentsRouter, paymentMethodsRouter } from './resources/outboundPayments.js';
import { settleCard, transactionsRouter, type SettleRequest } from './resources/transactions.js';
import { FakeStore } from './store/store.js';
import type { TransactionObject, WebhookEndpoint } from './store/types.js';
import { DEFAULT_RETRY_POLICY, WebhookDispatcher, type WebhookRetryPolicy } from './webhooks/dispatcher.js';

/** The API version stripe-node 23.1 pins; used for events when a request names none. */
export const DEFAULT_API_VERSION = '2026-10-28.endive';

export interface PaymentsFakeOptions {
  /** Where `state.json` lives. Omit (or null) to keep everything in memory only. */
  dataDir?: string | null;
  /** Endpoint that receives signed events; the control API can replace it at run time. */
  webhook?: WebhookEndpoint | null;
  webhookRetry?: Partial<WebhookRetryPolicy>;
  idempotencyTtlMs?: number;
  /** Clock in epoch milliseconds; tests inject one to step past the 24-hour key lifetime. */
  now?: () => number;
  apiVersion?: string;
}

export interface PaymentsFake {
  /** Express app with no listener; call `app.listen(port, '127.0.0.1')`. */
  app: Express;
  store: FakeStore;
  webhooks: WebhookDispatcher;
  faults: { api: ApiFaults; webhooks: WebhookFaults };
  /** Same as `POST /__control/issuing/cards/:id/settle`. */
  settle(cardId: string, request?: SettleRequest): TransactionObject;
  /** Same as `POST /__control/reset`. */
  reset(): void;
  /** Stops webhook delivery and ends held responses. Close your HTTP server separately. */
  close(): Promise<void>;
}

export function createPaymentsFake(options: PaymentsFakeOptions = {}): PaymentsFake {
  const now = options.now ?? Date.now;
  const apiVersion = options.apiVersion ?? DEFAULT_API_VERSION;
  const store = new FakeStore(options.dataDir ?? null);
  const apiFaults = new ApiFaults();
  const webhookFaults = new WebhookFaults();
  const holds = new Holds();
  const policy = { ...DEFAULT_RETRY_POLICY, ...options.webhookRetry };
  const webhooks = new WebhookDispatcher(store, webhookFaults, policy, options.webhook ?? null, now);
  const events = new EventLog(store, webhooks, now, apiVersion);
  const idempotency = new IdempotencyLayer(store, options.idempotencyTtlMs ?? DEFAULT_IDEMPOTENCY_TTL_MS, now);

  const resources: ResourceDeps = { store, events, now };
  const runner: RunnerDeps = { store, idempotency, holds };
  const reset = () => {
    store.reset();
    apiFaults.clear();
    webhookFaults.clear();
    webhooks.resetMemory();
  };

  const api = Router();
  api.use(requestContext(apiVersion), authenticate, requireFormBody);
  api.use(express.text({ type: () => true, limit: '1mb' }));
  api.use(faultsBefore(apiFaults, holds));
  api.use('/issuing/cardholders', cardholdersRouter(resources, runner));
  api.use('/issuing/cards', cardsRouter(resources, runner));
  api.use('/issuing/transactions', transactionsRouter(resources, runner));
  api.use('/events', eventsRouter(resources, runner));
  api.use('/ephemeral_keys', ephemeralKeysRouter(resources, runner));
  api.use('/payment_methods', paymentMethodsRouter(resources, runner));
  api.use('/treasury/outbound_payments', outboundPaymentsRouter(resources, runner));
  api.use('/test_helpers/treasury/outbound_payments', outboundPaymentHelpersRouter(resources, runner));
  api.use(unknownRoute);
  api.use(apiErrorHandler);

  const app = express();
  app.disable('x-powered-by');
  app.set('etag', false);
  app.get('/', (_req, res) => {
    res.type('html').send(renderPage(store.state));
  });
  app.use('/__control', controlRouter({ ...resources, apiFaults, webhookFaults, webhooks, reset }));
  app.use('/v1', api);

  webhooks.start();

  return {
    app,
    store,
    webhooks,
    faults: { api: apiFaults, webhooks: webhookFaults },
    settle: (cardId, request = {}) => settleCard(resources, cardId, request),
    reset,
    close: async () => {
      holds.releaseAll();
      await webhooks.close();
    },
  };
}
