import express, { Router } from 'express';
import helmet from 'helmet';
import passport from 'passport';
import path from 'node:path';
import { existsSync } from 'node:fs';
import type { DataSource } from 'typeorm';
import type { Env } from './config/env';
import { createCsrf } from './http/csrf';
import { errorHandler } from './http/error-handler';
import { notFound } from './http/errors';
import type { SessionSetup } from './http/session';
import { authRouter, configurePassport } from './modules/auth/auth.routes';
import type { SignInThrottle } from './modules/auth/throttle';
import { departuresRouter } from './modules/flights/flights.routes';
import { healthRouter } from './modules/health/health.routes';
import { stationsRouter } from './modules/stations/stations.routes';
import { usersRouter } from './modules/users/users.routes';
import { plansRouter } from './modules/plans/plans.routes';
import { flightDeskRouter } from './modules/flights/flight-desk.routes';
import { integrationEventsRouter } from './modules/integrations/events.routes';
import { integrationKeysRouter } from './modules/integrations/integration-keys.routes';
import { manifestsRouter } from './modules/manifests/manifests.routes';
import { showUpProfilesRouter } from './modules/show-up-profiles/show-up-profiles.routes';
import { noticesRouter, stationNoticesRouter } from './modules/outbox/outbox.routes';
import { adminFlightsRouter } from './modules/flights/admin-flights.routes';
import { schedulesRouter } from './modules/schedules/schedules.routes';
import { auditRouter } from './modules/audit/audit.routes';
import { createForecastScheduler, type ForecastScheduler } from './modules/forecast/forecast-scheduler';
import { silentPublisher, type Publisher } from './realtime/publisher';
import { subscribeAppEffects } from './app-effects';
import { announceCommitted, forecastStale } from './events';
import { volunteersRouter } from './modules/volunteers/volunteers.routes';
import { approvalsRouter } from './modules/approvals/approvals.routes';
import { denialsRouter } from './modules/denials/denials.routes';
import { forecastAnnouncer } from './modules/denials/ranking-notices';
import { configureCarrierName } from './modules/denials/statement';
import { carrierNameFrom } from './config/carrier';
import { publicOffersRouter } from './modules/volunteers/public-offers.routes';
import { createPaymentsRuntime, type PaymentsRuntime } from './modules/payments/payments-runtime';
import { createReconciliationRunner, type ReconciliationRunner } from './modules/finance/reconciliation.service';
import { financeRouter } from './modules/finance/finance.routes';
import { alertsRouter } from './modules/alerts/alerts.routes';
import { cabinChangesRouter } from './modules/cabin-changes/cabin-changes.routes';
import { refundsRouter } from './modules/refunds/refunds.routes';
import { careRouter } from './modules/care/care.routes';
import { learningRouter } from './modules/learning/learning.routes';
import { createLearningRuntime, type LearningRuntime } from './modules/learning/learning-runtime';
import { stationsOnLatestRates } from './modules/learning/rates.service';
import { openFlightIds } from './modules/show-up-profiles/show-up-profiles.service';

export interface AppDeps {
  env: Env;
  db: DataSource;
  session: SessionSetup;
  throttle: SignInThrottle;
  demo: boolean;
  /** Called when a user must lose every live connection at once (sign-out, deactivation, a new password). */
  disconnectUser?: (userId: number) => void;
  /** Called when a user's stations or role changed: live connections drop what the user may no longer watch. */
  userAccessChanged?: (userId: number) => void;
  /** Tells live consoles what changed; silent in tests that do not watch sockets. */
  publisher?: Publisher;
  /** Coalesced forecast recomputes; built here when the caller does not bring one. */
  forecast?: ForecastScheduler;
  /** Compensation payments (provider client, issuer, worker); built from env when absent, its worker not started. */
  payments?: PaymentsRuntime;
  /** Finance's reconciliation runs; built here over the payments module's reader when absent. */
  reconciliation?: ReconciliationRunner;
  /** Training runs of the learned show rates; built here (its clock not started) when absent. */
  learning?: LearningRuntime;
}

/** Builds the whole HTTP app without listening, so tests run it in-process on port 0. */
export function createApp(deps: AppDeps) {
  configureCarrierName(carrierNameFrom(deps.env, deps.demo));
  const app = express();
  // Which proxies may name the client's address is configuration (default none): the sign-in throttle and the logs use
  // req.ip, and trusting X-Forwarded-For from anyone would let a client choose the address it is throttled as.
  app.set('trust proxy', deps.env.TRUST_PROXY);
  app.disable('x-powered-by');
  app.use(helmet({ contentSecurityPolicy: { directives: { 'upgrade-insecure-requests': null, 'img-src': ["'self'", 'data:'] } } }));

  app.use('/api/health', healthRouter(deps));

  const publisher = deps.publisher ?? silentPublisher;
  const forecast = deps.forecast ?? createForecastScheduler(deps.db, forecastAnnouncer(deps.db));
  // Services record what a change means inside its transaction; after the commit it reaches these subscribers.
  subscribeAppEffects(deps.db, publisher, forecast);
  const payments = deps.payments ?? createPaymentsRuntime({ db: deps.db, env: deps.env });
  // The provider's signed webhooks: the signature covers the raw body, so this comes before any JSON parser and
  // outside the session and CSRF middleware.
  app.use('/api/payments/webhook', payments.webhookRouter());
  // The passenger's "Offer your seat" page: no session; signed links and booking proof instead.
  // The passenger's card-details and payout pages: single-use links, no session.
  app.use('/api/public/payments', payments.passengerRouter());
  app.use('/api/public', publicOffersRouter({ db: deps.db, secret: deps.env.SESSION_SECRET, counters: { pool: deps.session.pool.pool, dbName: deps.session.dbName } }));
  app.use('/api/integrations', integrationEventsRouter({ db: deps.db }));

  configurePassport(deps.db);
  const csrf = createCsrf(deps.env);
  const api = Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(deps.session.middleware, deps.session.enforceAbsoluteTimeout);
  api.use(passport.session());
  api.use(csrf.protection);
  api.use('/auth', authRouter({ db: deps.db, throttle: deps.throttle, csrf, cookieName: deps.session.cookieName, demo: deps.demo, onSignOut: deps.disconnectUser }));
  api.use('/users', usersRouter({ db: deps.db, throttle: deps.throttle, onUserSignedOut: deps.disconnectUser, onUserAccessChanged: deps.userAccessChanged }));
  api.use(volunteersRouter({ db: deps.db, secret: deps.env.SESSION_SECRET, appBaseUrl: deps.env.APP_BASE_URL }));
  api.use(approvalsRouter({ db: deps.db }));
  api.use(denialsRouter({ db: deps.db }));
  api.use(payments.compensationsRouter());
  // Finance reads the money payments moved through the payments module's read interface, never the provider.
  const reconciliation = deps.reconciliation ?? createReconciliationRunner({ db: deps.db, reader: payments.reader, log: (line) => console.warn(line) });
  api.use('/finance', financeRouter({ db: deps.db, reconciliation }));
  api.use('/alerts', alertsRouter({ db: deps.db }));
  api.use(cabinChangesRouter({ db: deps.db }));
  api.use(refundsRouter({ db: deps.db }));
  api.use(careRouter({ db: deps.db }));
  // The station run from the screens: flights, schedules, notices and the audit log.
  api.use(adminFlightsRouter({ db: deps.db }));
  api.use(schedulesRouter({ db: deps.db }));
  api.use(stationNoticesRouter({ db: deps.db }));
  api.use(auditRouter({ db: deps.db }));
  api.use('/stations/:stationId/integration-keys', integrationKeysRouter(deps));
  api.use('/stations/:stationId/manifests', manifestsRouter({ db: deps.db }));
  api.use('/stations/:stationId/show-up-profile', showUpProfilesRouter({ db: deps.db }));
  api.use('/stations', stationsRouter(deps));
  api.use('/flights/:flightId/notices', noticesRouter({ db: deps.db }));
  api.use('/flights', flightDeskRouter({ db: deps.db }));
  api.use('/departures', departuresRouter(deps));
  api.use('/plans', plansRouter(deps));
  // Forecasts of a station whose rates changed are recomputed; the answer does not wait for them.
  const recomputeStation = (stationId: number) => void openFlightIds(deps.db, stationId).then((ids) => announceCommitted(deps.db, ...ids.map(forecastStale))).catch(() => undefined);
  const learning = deps.learning ?? createLearningRuntime(deps.db, { forecast, onNewVersion: () => void stationsOnLatestRates(deps.db).then((ids) => ids.forEach(recomputeStation)).catch((err: unknown) => console.error(`[learning] could not refresh the stations on the new rates: ${String(err)}`)) });
  api.use('/learning', learningRouter({ db: deps.db, runtime: learning, onChoiceChanged: recomputeStation }));
  api.use((req) => {
    throw notFound(`The API route ${req.method} ${req.path}`);
  });
  app.use('/api', api);

  const staticDir = path.resolve(deps.env.STATIC_DIR);
  if (existsSync(staticDir)) {
    app.use(express.static(staticDir, { index: false, maxAge: '1h' }));
    // The single-page app answers every other path; the client router takes over.
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(staticDir, 'index.html')));
  }

  app.use(errorHandler());
  return app;
}
