// Assembles the payments module from configuration: one provider client, one issuer shared by the routes and the
// worker, so an issuance in flight is never started twice by this process, and the read interface others (finance)
// use to see the money moved, without calling the provider themselves.
import type Stripe from 'stripe';
import type { DataSource } from 'typeorm';
import type { Env } from '../../config/env';
import { newClaimerId, rowClaimer } from '../../db/claim-rows';
import { stripeIssuingProvider, type IssuingProvider } from '../../integrations/payments/issuing-provider';
import { createStripeClient, providerAccountOf } from '../../integrations/payments/stripe-client';
import { stripePassengerProvider } from '../../integrations/payments/passenger-provider';
import { passengerPaymentsRouter } from '../payouts/public-payments.routes';
import { compensationsRouter } from './compensations.routes';
import { createIssuer, type Issuer } from './issuer';
import type { PaymentsContext } from './payments-context';
import { createPaymentsReader, type PaymentsReader } from './reader';
import { createPaymentsWorker, type PaymentsWorker, type PaymentsWorkerOptions } from './payments-worker';
import { paymentsWebhookRouter } from './webhook.routes';

/**
 * The financial account transfers leave from until configuration names the carrier's own; the local stand-in accepts
 * any fa_ id.
 */
const DEFAULT_FINANCIAL_ACCOUNT = 'fa_bumpboard_compensations';

export interface PaymentsRuntimeOptions {
  db: DataSource;
  /** The SDK pointed at Stripe or the local stand-in; built from env when absent. */
  stripe?: Stripe;
  env: Pick<Env, 'STRIPE_SECRET_KEY' | 'STRIPE_API_URL' | 'STRIPE_WEBHOOK_SECRET'> & Partial<Pick<Env, 'APP_BASE_URL' | 'PAYMENTS_LEASE_SECONDS'>>;
  /** The carrier's Treasury financial account that bank transfers leave from. */
  financialAccount?: string;
  /** Clock for the passenger's links (epoch ms); tests step it past an expiry. */
  now?: () => number;
  log?: (line: string) => void;
  worker?: PaymentsWorkerOptions;
  /** Per-request timeout of the SDK (tests use a short one to exercise timeouts). */
  stripeTimeoutMs?: number;
}

export interface PaymentsRuntime {
  ctx: PaymentsContext;
  provider: IssuingProvider;
  issuer: Issuer;
  worker: PaymentsWorker;
  /** Read-only: the provider's cards, card transactions and transfers, for finance. */
  reader: PaymentsReader;
  webhookRouter(): ReturnType<typeof paymentsWebhookRouter>;
  compensationsRouter(): ReturnType<typeof compensationsRouter>;
  /** The passenger's card-details and bank-account pages' API: no session, single-use links. */
  passengerRouter(): ReturnType<typeof passengerPaymentsRouter>;
  /** Starts the worker (its first pass sweeps every row left 'issuing'). */
  start(): Promise<void>;
  stop(): Promise<void>;
}

export function createPaymentsRuntime(opts: PaymentsRuntimeOptions): PaymentsRuntime {
  const stripe = opts.stripe ?? createStripeClient({ secretKey: opts.env.STRIPE_SECRET_KEY, apiUrl: opts.env.STRIPE_API_URL, timeoutMs: opts.stripeTimeoutMs });
  const provider = stripeIssuingProvider(stripe, opts.env.STRIPE_WEBHOOK_SECRET);
  const log = opts.log ?? ((line: string) => console.warn(line));
  const providerAccount = providerAccountOf({ apiUrl: opts.env.STRIPE_API_URL, secretKey: opts.env.STRIPE_SECRET_KEY });
  const passenger = stripePassengerProvider(stripe, opts.financialAccount ?? DEFAULT_FINANCIAL_ACCOUNT);
  const claimer = newClaimerId();
  const ctx: PaymentsContext = {
    db: opts.db, provider, providerAccount, log, passenger,
    appBaseUrl: (opts.env.APP_BASE_URL ?? 'http://127.0.0.1:4600').replace(/\/$/, ''), now: opts.now ?? Date.now,
    claims: {
      compensations: rowClaimer(opts.db, { table: 'compensations', key: 'id' }, claimer),
      payouts: rowClaimer(opts.db, { table: 'payouts', key: 'attempt_key' }, claimer),
      leaseMs: (opts.env.PAYMENTS_LEASE_SECONDS ?? 120) * 1000,
    },
  };
  const issuer = createIssuer(ctx);
  const worker = createPaymentsWorker(ctx, issuer, opts.worker);
  return {
    ctx,
    provider,
    issuer,
    worker,
    reader: createPaymentsReader(provider, passenger),
    webhookRouter: () => paymentsWebhookRouter(ctx),
    compensationsRouter: () => compensationsRouter(ctx, issuer),
    passengerRouter: () => passengerPaymentsRouter(ctx, issuer),
    async start() {
      worker.start();
    },
    async stop() {
      await worker.stop();
      await issuer.idle();
    },
  };
}
