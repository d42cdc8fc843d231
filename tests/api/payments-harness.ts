// For the payments and finance API tests: the payments stand-in in-process on port 0, an app instance wired to it
// (which can be "crashed" and replaced on the same port), and rows of a test station made straight in the database.
import { removeFlights as removeTestFlights } from './volunteers-fixtures';
import 'reflect-metadata';
import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { DataSource } from 'typeorm';
import { vi } from 'vitest';
import { createPaymentsFake, type PaymentsFake, type PaymentsFakeOptions } from '../../payments-fake/src/app';
import { loadEnv } from '../../server/src/config/env';
import { createDataSource } from '../../server/src/db/data-source';
import { createApp } from '../../server/src/app';
import { BookingEntity, CompensationEntity, FlightEntity, PassengerEntity, PaymentAgreementEntity, StationEntity } from '../../server/src/db/entities';
import { createSessionSetup } from '../../server/src/http/session';
import { createSignInThrottle } from '../../server/src/modules/auth/throttle';
import { createPaymentsRuntime, type PaymentsRuntime } from '../../server/src/modules/payments/payments-runtime';
import type { PaymentsWorkerOptions } from '../../server/src/modules/payments/payments-worker';
import { RUN_ID } from './helpers';

function listen(server: Server, port = 0): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve((server.address() as AddressInfo).port));
  });
}

async function closeServer(server: Server): Promise<void> {
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
}

export interface RunningFake {
  fake: PaymentsFake;
  port: number;
  url: string;
  stop(): Promise<void>;
}

/** `port`: a restart on the port it had, so the server still talks to "the same provider" at the same URL. */
export async function startFake(options: PaymentsFakeOptions = {}, port = 0): Promise<RunningFake> {
  const fake = createPaymentsFake(options);
  const server = createServer(fake.app);
  port = await listen(server, port);
  return {
    fake,
    port,
    url: `http://127.0.0.1:${port}`,
    async stop() {
      await fake.close();
      await closeServer(server);
    },
  };
}

export const WEBHOOK_SECRET = `whsec_test_${randomBytes(12).toString('hex')}`;

export interface PaymentsApp {
  app: ReturnType<typeof createApp>;
  db: DataSource;
  runtime: PaymentsRuntime;
  port: number;
  baseUrl: string;
  webhookUrl: string;
  /** A clean stop: the worker finishes what it started. */
  close(): Promise<void>;
  /** As if the process died: connections cut, the database gone at once, attempts in flight never recorded. */
  crash(): Promise<void>;
}

export interface PaymentsAppOptions {
  stripeApiUrl: string;
  port?: number;
  worker?: PaymentsWorkerOptions;
  startWorker?: boolean;
  stripeTimeoutMs?: number;
  log?: (line: string) => void;
  /** Clock of the passenger's payment links (epoch ms). */
  now?: () => number;
  /** How long a claim on a row being paid holds (the default is two minutes); tests of a crash take it shorter. */
  claimLeaseSeconds?: number;
  /** A provider account of the test's own (the worker passes over rows started under another): the shared one when absent. */
  secretKey?: string;
}

export async function startPaymentsApp(opts: PaymentsAppOptions): Promise<PaymentsApp> {
  const env = loadEnv({
    ...process.env,
    NODE_ENV: 'test',
    SESSION_SECRET: process.env.SESSION_SECRET ?? 'test-secret-test-secret-test-secret-42',
    STATIC_DIR: 'no-static-in-api-tests',
    STRIPE_API_URL: opts.stripeApiUrl,
    STRIPE_SECRET_KEY: opts.secretKey ?? 'sk_test_bumpboard_api_tests',
    STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
    ...(opts.claimLeaseSeconds ? { PAYMENTS_LEASE_SECONDS: String(opts.claimLeaseSeconds) } : {}),
  });
  const db = createDataSource(env.DATABASE_URL);
  await db.initialize();
  const session = createSessionSetup(env);
  const runtime = createPaymentsRuntime({ db, env, worker: opts.worker, stripeTimeoutMs: opts.stripeTimeoutMs, log: opts.log ?? (() => undefined), now: opts.now });
  const app = createApp({ env, db, session, payments: runtime, throttle: createSignInThrottle({ perAccount: 1000, perAddress: 10_000 }), demo: true });
  const http = createServer(app);
  const port = await listen(http, opts.port ?? 0);
  if (opts.startWorker !== false) await runtime.start();
  const baseUrl = `http://127.0.0.1:${port}`;
  return {
    app, db, runtime, port, baseUrl,
    webhookUrl: `${baseUrl}/api/payments/webhook`,
    async close() {
      await runtime.stop();
      await closeServer(http);
      await session.close();
      await db.destroy();
    },
    async crash() {
      void runtime.worker.stop();
      await closeServer(http);
      await Promise.allSettled([session.close(), db.destroy()]);
    },
  };
}

// ── Test rows ───────────────────────────────────────────────────────────────────────────────────────────────

/** A station none of the demo users belongs to, made once and reused by later runs (Portland, Maine: a US airport). */
export async function paymentsTestStation(
  db: DataSource,
  iata = 'PWM',
  rules: Pick<StationEntity, 'regime' | 'currency' | 'timeZone'> = { regime: 'us-dot', currency: 'USD', timeZone: 'America/New_York' },
): Promise<StationEntity> {
  const repo = db.getRepository(StationEntity);
  const existing = await repo.findOneBy({ iata });
  if (existing) return existing;
  return repo.save(repo.create({ iata, name: `${iata} (payments test station)`, ...rules }));
}

let flightSequence = 0;

/** A flight of `passengers` people in parties of up to four, each booking with a .test address (RFC 2606). */
export async function seedFlight(db: DataSource, station: StationEntity, opts: { passengers: number; serviceDate?: string; destination?: string }) {
  const serviceDate = opts.serviceDate ?? '2026-11-20';
  flightSequence += 1;
  const flights = db.getRepository(FlightEntity);
  let flight: FlightEntity | undefined;
  for (let attempt = 0; !flight && attempt < 20; attempt += 1) {
    const number = String(1000 + Math.floor(Math.random() * 9000));
    if (await flights.findOneBy({ carrierCode: 'ZP', flightNumber: number, serviceDate, origin: station.iata })) continue;
    const departure = new Date(`${serviceDate}T15:00:00Z`);
    flight = await flights.save(flights.create({
      stationId: station.id, carrierCode: 'ZP', flightNumber: number, serviceDate, origin: station.iata, destination: opts.destination ?? 'ORD',
      scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + 3 * 3_600_000), aircraftType: '320', seatsByCabin: { Y: 150 },
      gate: null, state: 'departed', shock: null,
    }));
  }
  if (!flight) throw new Error('no free test flight number');
  const bookings: BookingEntity[] = [];
  for (let i = 0; i < Math.ceil(opts.passengers / 4); i += 1) {
    bookings.push(db.getRepository(BookingEntity).create({ flightId: flight.id, pnr: `P${flightSequence % 10}${String(i).padStart(5, '0')}`.slice(0, 8), contactEmail: `pax-${RUN_ID}-${flight.id}-${i}@example.test`, travelsTogether: true, status: 'active' }));
  }
  const savedBookings = await db.getRepository(BookingEntity).save(bookings, { chunk: 200 });
  const passengers: PassengerEntity[] = [];
  for (let i = 0; i < opts.passengers; i += 1) {
    const booking = savedBookings[Math.floor(i / 4)];
    passengers.push(db.getRepository(PassengerEntity).create({
      bookingId: booking.id, flightId: flight.id, pnrSequence: (i % 4) + 1, firstName: ['Ana', 'José-María', 'Zoë', 'Li'][i % 4], lastName: `Tester${i}`,
      cabin: 'Y', fareMinor: 25_000, fareCurrency: 'USD', fareType: 'standard', ssrCodes: [], frequentFlyerTier: null, isChild: false,
      inboundFlight: null, inboundScheduledArrival: null, inboundEstimatedArrival: null, seat: null, status: 'boarded', checkedInAt: null, boardedAt: null, statusChangedAt: null,
    }));
  }
  const savedPassengers = await db.getRepository(PassengerEntity).save(passengers, { chunk: 200 });
  return { flight, passengers: savedPassengers };
}

let sourceSequence = 0;

/** Compensation rows as a round or a denial would leave them ('due', the amount cleared by a gated offer), one per passenger given. */
export async function insertCompensations(
  db: DataSource,
  flight: FlightEntity,
  passengers: PassengerEntity[],
  over: (index: number) => Partial<CompensationEntity> = () => ({}),
): Promise<CompensationEntity[]> {
  const repo = db.getRepository(CompensationEntity);
  // Source ids far above any real volunteer row, unique to this run, so the unique source key never collides.
  const base = 2_000_000_000 - (Number.parseInt(RUN_ID.slice(-6), 16) % 100_000) * 1_000 - (sourceSequence += passengers.length);
  const rows = passengers.map((p, i) => repo.create({
    stationId: flight.stationId, flightId: flight.id, bookingId: p.bookingId, passengerId: p.id, sourceKind: 'volunteer', sourceId: base - i,
    regime: 'us-dot', voluntary: true, amountMinor: 40_000 + (i % 7) * 5_000, currency: 'USD', band: 'volunteer', ruleRef: 'agreed with the volunteer',
    explanation: 'Volunteered (API test).', form: 'prepaid-card', voucherAgreedAt: null, state: 'due', idempotencyKey: null,
    providerCardholderId: null, providerCardId: null, lastError: null, voidReason: null, amountClearedBy: 'offer of round (API test)', ...over(i),
  }));
  const saved = await repo.save(rows, { chunk: 200 });
  // A denied passenger is paid by card only with their agreement: the fixture records one, as the desk would.
  const agreed = saved.filter((r) => !r.voluntary && r.medium === 'prepaid-card');
  if (agreed.length) {
    await db.getRepository(PaymentAgreementEntity).insert(agreed.map((r) => ({
      compensationId: r.id, medium: 'prepaid-card' as const, text: 'The passenger accepted a prepaid card instead of money (API test fixture).', cashAmountMinor: r.amountMinor,
      // Canada asks for a value above the money owed.
      valueMinor: r.regime === 'ca-appr' ? r.amountMinor + 100 : r.amountMinor, currency: r.currency, expiresOn: null, method: 'desk-signature' as const, signature: FIXTURE_SIGNATURE, statement: null, acceptedAt: new Date(), staffUserId: null,
    })));
  }
  return saved;
}

/** A PNG data URL long enough to count as a drawn signature. */
export const FIXTURE_SIGNATURE = `data:image/png;base64,${'iVBORw0KGgo'.padEnd(400, 'A')}`;

/** Removes what a test made on its flights, with the provider's card mirror; audit rows stay, the log is append-only. */
export async function removeFlights(db: DataSource, flightIds: number[]): Promise<void> {
  if (!flightIds.length) return;
  await db.query('DELETE FROM provider_cards WHERE compensation_id IN (SELECT id FROM compensations WHERE flight_id IN (?))', [flightIds]);
  await removeTestFlights(db, flightIds);
}

/** Waits until the condition holds; bounded, so a broken run fails instead of hanging. */
export async function until(what: string, condition: () => Promise<boolean> | boolean, timeoutMs = 60_000, everyMs = 100): Promise<void> {
  await vi.waitFor(async () => {
    if (!(await condition())) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
  }, { timeout: timeoutMs, interval: everyMs });
}

/** The fake has sent (or given up on) every webhook it queued. */
export function webhooksSettled(fake: PaymentsFake): boolean {
  return fake.webhooks.deliveries().every((d) => d.status === 'delivered' || d.status === 'failed');
}
