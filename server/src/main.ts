// Start-up order: config → database → HTTP server → socket.io → listen. Stops cleanly on SIGINT/SIGTERM.
import { createServer } from 'node:http';
import { loadEnv } from './config/env';
import { createDataSource } from './db/data-source';
import { createApp } from './app';
import { createSessionSetup } from './http/session';
import { createSignInThrottle } from './modules/auth/throttle';
import { createSocketServer, disconnectUserSockets, refreshUserSockets, type AppIo } from './realtime/socket-server';
import { socketPublisher } from './realtime/publisher';
import { followPeers, shareThroughRedis } from './realtime/peers';
import { createForecastScheduler } from './modules/forecast/forecast-scheduler';
import { announceCommitted, forecastStale } from './events';
import { createMailTransport } from './integrations/mail/mail-transport';
import { createOutboxWorker } from './modules/outbox/outbox-worker';
import { createPaymentsRuntime } from './modules/payments/payments-runtime';
import { createReconciliationRunner, markInterruptedRuns } from './modules/finance/reconciliation.service';
import { createLearningRuntime } from './modules/learning/learning-runtime';
import { stationsOnLatestRates } from './modules/learning/rates.service';
import { openFlightIds } from './modules/show-up-profiles/show-up-profiles.service';
import { watchPaymentDeadlines } from './modules/compensations/payment-deadlines';
import { forecastAnnouncer } from './modules/denials/ranking-notices';

const env = loadEnv();
const db = createDataSource(env.DATABASE_URL, { socketPath: env.DATABASE_SOCKET });
await db.initialize();
const session = createSessionSetup(env);
const ioRef: { io?: AppIo } = {};
const publisher = socketPublisher(() => ioRef.io);
const forecast = createForecastScheduler(db, forecastAnnouncer(db), {
  leaseMs: env.RECOMPUTE_LEASE_SECONDS * 1000,
});
const mailTransport = createMailTransport(env);
const outbox = createOutboxWorker(db, mailTransport, { leaseMs: env.OUTBOX_LEASE_SECONDS * 1000 });
outbox.start();
const payments = createPaymentsRuntime({ db, env });
// Reconciliation runs a stopped process left 'running' are closed as interrupted, never left hanging.
await markInterruptedRuns(db);
const reconciliation = createReconciliationRunner({ db, reader: payments.reader, log: (line) => console.warn(line) });
// Nightly training and the recording of departed flights; a run left unfinished by a stop is queued again.
const learning = createLearningRuntime(db, {
  forecast,
  onNewVersion: () => void stationsOnLatestRates(db).then(async (stations) => {
    for (const s of stations) announceCommitted(db, ...(await openFlightIds(db, s)).map(forecastStale));
  }).catch(() => undefined),
});
const stopDeadlineWatch = watchPaymentDeadlines(db);
const app = createApp({
  payments,
  reconciliation,
  learning,
  publisher,
  forecast,
  env,
  db,
  session,
  // Counts kept in MariaDB: a restart or a second server process does not hand a guesser a fresh allowance.
  throttle: createSignInThrottle({ mysql: { pool: session.pool.pool, dbName: session.dbName } }),
  demo: env.NODE_ENV !== 'production',
  disconnectUser: (id) => ioRef.io && disconnectUserSockets(ioRef.io, id),
  userAccessChanged: (id) => {
    if (ioRef.io) refreshUserSockets(ioRef.io, db, id).catch((err: unknown) => console.error(`[server] could not refresh the sockets of user ${id}: ${String(err)}`));
  },
});
// Started once the app has subscribed to committed changes, so nothing they announce (a recompute asked for, a
// payment's notice) leaves before anyone listens. The payments worker's first pass retries every compensation a
// stopped server left 'issuing', with the keys fixed on each row; a training run left unfinished is queued again.
forecast.startClock();
await payments.start();
await learning.start();
const http = createServer(app);
ioRef.io = createSocketServer(http, { db, sessionMiddleware: session.middleware });
// Several processes: rooms and the flights' news shared through Redis (one process alone needs neither).
const closeRedis = env.REDIS_URL ? await shareThroughRedis(ioRef.io, env.REDIS_URL) : async () => undefined;
followPeers(ioRef.io, db);
http.listen(env.PORT, env.HOST, () => {
  console.log(`[server] listening on http://${env.HOST}:${env.PORT}`);
});

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`[server] ${signal}: stopping`);
  forecast.stop();
  learning.stop();
  stopDeadlineWatch();
  ioRef.io?.close();
  await closeRedis();
  // Requests already being handled finish before the database goes away (bounded, so a stuck client cannot hold us).
  await new Promise<void>((resolve) => {
    http.close(() => resolve());
    http.closeIdleConnections();
    setTimeout(resolve, 5_000).unref();
  });
  // The send in flight finishes and is recorded before the database goes away.
  await outbox.stop();
  await payments.stop();
  await reconciliation.idle();
  mailTransport.close();
  await session.close();
  await db.destroy();
  process.exit(0);
}
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));
