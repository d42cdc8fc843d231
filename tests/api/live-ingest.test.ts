// What a burst from the feed costs the database: a batch is one transaction with set-based, guarded updates, and its
// flights are recomputed once each after it, so the statements per event stay at a few even with the recompute
// counted in. Statements are counted as the app sends them (TypeORM's logger sees every one).
import 'reflect-metadata';
import request from 'supertest';
import type { DataSource, Logger } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/src/app';
import { loadEnv } from '../../server/src/config/env';
import { createDataSource } from '../../server/src/db/data-source';
import { PassengerEntity, type FlightEntity } from '../../server/src/db/entities';
import { createSessionSetup } from '../../server/src/http/session';
import { createSignInThrottle } from '../../server/src/modules/auth/throttle';
import { createForecastScheduler, type ForecastScheduler } from '../../server/src/modules/forecast/forecast-scheduler';
import { applyEventBatch } from '../../server/src/modules/integrations/events.service';
import { applyFeedEvents } from '../../server/src/modules/integrations/feed-line';
import { createIntegrationKey } from '../../server/src/modules/integrations/integration-keys.service';
import { addBooking, createFlight, removeDenialFixtures } from './denials-fixtures';
import { RUN_ID } from './helpers';

let db: DataSource;
let app: ReturnType<typeof createApp>;
let closeSession: () => Promise<void>;
let scheduler: ForecastScheduler;
let key: string;
let serial = 0;
let statements = 0;

beforeAll(async () => {
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', SESSION_SECRET: process.env.SESSION_SECRET ?? 'test-secret-test-secret-test-secret-42', STATIC_DIR: 'no-static-in-api-tests' });
  db = createDataSource(env.DATABASE_URL);
  await db.initialize();
  const counting: Logger = {
    logQuery: () => void statements++, logQueryError: () => undefined, logQuerySlow: () => undefined, logSchemaBuild: () => undefined,
    logMigration: () => undefined, log: () => undefined,
  };
  (db as unknown as { logger: Logger }).logger = counting;
  const session = createSessionSetup(env);
  closeSession = () => session.close();
  scheduler = createForecastScheduler(db, () => undefined);
  app = createApp({ env, db, session, throttle: createSignInThrottle({ perAccount: 1000, perAddress: 10_000 }), demo: true, forecast: scheduler });
  const probe = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 1 });
  key = (await createIntegrationKey(db, probe.stationId, `live ingest ${RUN_ID}`, { label: 'live ingest test' })).key;
}, 60_000);
afterAll(async () => {
  await scheduler.flush();
  await removeDenialFixtures(db);
  await closeSession();
  await db.destroy();
});

const event = (flight: FlightEntity, pnr: string, type: string, at: number) => ({
  id: `live-ingest-${RUN_ID}-${++serial}`, type, occurredAt: new Date(at).toISOString(), pnr, sequence: 1,
  flight: { carrier: flight.carrierCode, number: flight.flightNumber, date: flight.serviceDate },
});
const feed = (events: unknown[]) => request(app).post('/api/integrations/events').set('Authorization', `Bearer ${key}`).send({ events });

async function flightOf(n: number) {
  const flight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: n });
  const pnrs: string[] = [];
  for (let i = 0; i < n; i++) pnrs.push((await addBooking(db, flight, [{ first: `Pax${i}`, last: 'Ingest', status: 'booked' }])).booking.pnr);
  return { flight, pnrs };
}

/** Check-ins for every passenger of two new flights of `n` each, all at one moment, once their first recompute is done. */
async function checkInsOnTwoFlights(n: number) {
  const a = await flightOf(n);
  const b = await flightOf(n);
  await scheduler.flush();
  const now = Date.now();
  const events = [...a.pnrs.map((p) => event(a.flight, p, 'passenger.checked-in', now)), ...b.pnrs.map((p) => event(b.flight, p, 'passenger.checked-in', now))];
  return { a, b, now, events };
}

describe('a burst from the feed', () => {
  it('costs at most 4 statements per event, the recompute of its flights included', async () => {
    const { a, now, events } = await checkInsOnTwoFlights(20);
    statements = 0;
    const res = await feed(events).expect(200);
    await scheduler.flush();
    expect(res.body.results.every((r: { status: string }) => r.status === 'applied')).toBe(true);
    // Hand count: the batch 2 (transaction) + 1 (ids seen) + 2 (flights) + 40 × 2 (lock, update) + 1 (event rows)
    // = 86; a recompute reads the flight and writes its figures in about a dozen, once per flight after the batch.
    expect(statements).toBeGreaterThan(2 * events.length); // the counter sees the statements
    expect(statements / events.length).toBeLessThanOrEqual(4);
    const rows = await db.getRepository(PassengerEntity).findBy({ flightId: a.flight.id });
    expect(rows.every((p) => p.status === 'checked-in' && p.checkedInAt?.getTime() === now)).toBe(true);
  });

  it('locks the passengers of a batch of status events in one read: 47 statements for 40 check-ins on two flights', async () => {
    const { a, events } = await checkInsOnTwoFlights(20);
    statements = 0;
    const { results } = await applyEventBatch(db, a.flight.stationId, events);
    // Counted before the recomputes it asks for start (they are queued for after this turn).
    const counted = statements;
    expect(results.every((r) => r.status === 'applied')).toBe(true);
    // Hand count: 2 (transaction) + 1 (ids seen) + 2 (flights) + 1 (every booking's passengers, locked) + 40
    // (guarded updates) + 1 (event rows) = 47; one locking read per event instead would make it 86.
    expect(counted).toBe(47);
    await scheduler.flush();
  });

  it('written together when they arrive together: single-event POSTs at once cost at most 4 statements per event', async () => {
    const { a, b, events } = await checkInsOnTwoFlights(30);
    statements = 0;
    // As a feed sends at its rate, one event per POST, many open at once: the first is written alone, the other 59
    // arrive while it is being written and go together in the next batch.
    const answers = await Promise.all(events.map((e) => applyFeedEvents(db, a.flight.stationId, [e])));
    await scheduler.flush();
    expect(answers.map((r) => r.results[0].status)).toEqual(events.map(() => 'applied'));
    expect(answers.every((r) => r.results.length === 1 && r.results[0].index === 0)).toBe(true);
    // Hand count: the lone batch 2 + 1 + 1 + 1 (its locking read) + 1 + 1 = 7; the next 2 + 1 + 2 + 1 + 59 + 1 = 66;
    // at most two recomputes per flight of about two dozen each. Each POST alone would cost 7 and its recompute.
    expect(statements).toBeGreaterThan(73);
    expect(statements / events.length).toBeLessThanOrEqual(4);
    const rows = await db.getRepository(PassengerEntity).findBy({ flightId: b.flight.id });
    expect(rows.every((p) => p.status === 'checked-in')).toBe(true);
  });

  it('a POST written with others keeps its own answer: a duplicate, a rejection and an applied event side by side', async () => {
    const { flight, pnrs } = await flightOf(3);
    const t = Date.now();
    const first = event(flight, pnrs[0], 'passenger.checked-in', t);
    const unknown = { ...event(flight, pnrs[1], 'passenger.checked-in', t), pnr: 'ZZZZZZ' };
    const [x, y, z, again] = await Promise.all([feed([first]), feed([unknown]), feed([event(flight, pnrs[2], 'passenger.checked-in', t)]), feed([first])]);
    expect(x.body.results[0].status === 'applied' ? again.body.results[0].status : x.body.results[0].status).toBe('duplicate');
    expect(y.body.results[0]).toMatchObject({ index: 0, status: 'rejected', details: [{ field: 'pnr' }] });
    expect(z.body).toMatchObject({ applied: 1, rejected: 0 });
  });

  it('a boarding that arrives before its check-in keeps the boarding and fills in the check-in time', async () => {
    const { flight, pnrs } = await flightOf(1);
    const t = Date.now();
    const boarded = event(flight, pnrs[0], 'passenger.boarded', t);
    const checkedIn = event(flight, pnrs[0], 'passenger.checked-in', t - 60_000);
    const res = await feed([boarded, checkedIn]).expect(200);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual(['applied', 'superseded']);
    const [p] = await db.getRepository(PassengerEntity).findBy({ flightId: flight.id });
    expect(p.status).toBe('boarded');
    expect(p.boardedAt?.getTime()).toBe(t);
    // Boarding set the check-in time it lacked; the older check-in keeps it (it is not later than the boarding).
    expect(p.checkedInAt?.getTime()).toBe(t);
  });
});
