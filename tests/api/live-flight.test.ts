// The live path end to end: a feed POST reaches the flight's consoles as a notice that carries the new version and
// what changed, the stored figures stay small and versioned, a stale recompute cannot overwrite a newer one, desk
// reads never write and answer 304 to the version a console holds, and replays, duplicates and out-of-order
// delivery of the same events leave the same state.
import 'reflect-metadata';
import fc from 'fast-check';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ChangedPayload } from '@shared/events';
import { flightDeskSchema } from '@shared/schemas/flight-desk';
import { createApp } from '../../server/src/app';
import { loadEnv } from '../../server/src/config/env';
import { createDataSource } from '../../server/src/db/data-source';
import { FlightEntity, FlightEventEntity, FlightForecastEntity, PassengerEntity } from '../../server/src/db/entities';
import { createSessionSetup } from '../../server/src/http/session';
import { createSignInThrottle } from '../../server/src/modules/auth/throttle';
import { createForecastScheduler, type ForecastScheduler } from '../../server/src/modules/forecast/forecast-scheduler';
import { writeIfNewer } from '../../server/src/modules/forecast/forecast.service';
import { readFlightState } from '../../server/src/modules/forecast/flight-state';
import { createIntegrationKey } from '../../server/src/modules/integrations/integration-keys.service';
import type { Publisher } from '../../server/src/realtime/publisher';
import { addBooking, createFlight, removeDenialFixtures } from './denials-fixtures';
import { Client } from './harness';
import { DEMO, RUN_ID } from './helpers';

let db: DataSource;
let app: ReturnType<typeof createApp>;
let closeSession: () => Promise<void>;
let scheduler: ForecastScheduler;
let agent: Client;
let key: string;
const notices: ChangedPayload[] = [];
let serial = 0;

beforeAll(async () => {
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', SESSION_SECRET: process.env.SESSION_SECRET ?? 'test-secret-test-secret-test-secret-42', STATIC_DIR: 'no-static-in-api-tests' });
  db = createDataSource(env.DATABASE_URL);
  await db.initialize();
  const session = createSessionSetup(env);
  closeSession = () => session.close();
  const publisher: Publisher = { flightChanged: (id, _stationId, topics, data) => notices.push({ id, topics, ...data }) };
  scheduler = createForecastScheduler(db, (o) => publisher.flightChanged(o.flightId, o.stationId, ['forecast', 'counts', 'events'], o.notice));
  app = createApp({ env, db, session, throttle: createSignInThrottle({ perAccount: 1000, perAddress: 10_000 }), demo: true, publisher, forecast: scheduler });
  agent = new Client(app);
  expect((await agent.signIn(DEMO.agent)).status).toBe(200);
  const bos = await db.getRepository(FlightEntity).findOneByOrFail({ origin: 'BOS' });
  key = (await createIntegrationKey(db, bos.stationId, `live test ${RUN_ID}`, { label: 'live flight test' })).key;
});
afterAll(async () => {
  await scheduler.flush();
  await removeDenialFixtures(db);
  await closeSession();
  await db.destroy();
});

async function flightWithTwo() {
  const flight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 1 });
  const { booking } = await addBooking(db, flight, [{ first: 'Ada', last: 'Alder', status: 'booked' }]);
  const other = await addBooking(db, flight, [{ first: 'Bo', last: 'Birch', status: 'booked' }]);
  return { flight, pnrs: [booking.pnr, other.booking.pnr] };
}

const event = (flight: FlightEntity, pnr: string, type: 'passenger.checked-in' | 'check-in.cancelled', at: number, id = `live-${RUN_ID}-${++serial}`) => ({
  id, type, occurredAt: new Date(at).toISOString(), pnr, sequence: 1, flight: { carrier: flight.carrierCode, number: flight.flightNumber, date: flight.serviceDate },
});
const feed = (events: unknown[]) => request(app).post('/api/integrations/events').set('Authorization', `Bearer ${key}`).send({ events });
const storedRow = (flightId: number) => db.getRepository(FlightForecastEntity).findOneBy({ flightId });

describe('feed POST to notice and stored summary', () => {
  it('tells the flight’s consoles the next version with the new counts, the moved passenger and the trail row', async () => {
    const { flight, pnrs } = await flightWithTwo();
    const first = flightDeskSchema.parse((await agent.get(`/api/flights/${flight.id}`).expect(200)).body);
    expect(first.version).toBe(0);
    expect(first.totals.checkedIn).toBe(0);

    const res = await feed([event(flight, pnrs[0], 'passenger.checked-in', Date.now())]).expect(200);
    expect(res.body.results[0].status).toBe('applied');
    await expect.poll(() => notices.find((n) => n.id === flight.id && n.version === 1), { timeout: 10_000 }).toBeTruthy();
    const n = notices.find((x) => x.id === flight.id && x.version === 1)!;
    expect(n.desk?.totals.checkedIn).toBe(1);
    expect(n.passengers?.map((p) => [p.lastName, p.status])).toEqual([['Alder', 'checked-in']]);
    expect(n.events?.map((e) => e.status)).toEqual(['applied']);
    // The distribution travels as its window: P(0), P(1), P(2) of two people, all above the floor.
    expect(n.desk?.forecast?.pmf.length).toBe(3);
    expect(JSON.stringify(n).length).toBeLessThan(2048);

    const row = (await storedRow(flight.id))!;
    expect(row.version).toBe(1);
    expect(JSON.stringify(row.forecast).length + JSON.stringify(row.detail).length).toBeLessThan(5 * 1024);
    const desk = flightDeskSchema.parse((await agent.get(`/api/flights/${flight.id}`).expect(200)).body);
    expect(desk).toMatchObject({ version: 1, totals: { checkedIn: 1 } });
  });

  it('a duplicate event id changes nothing and tells nobody', async () => {
    const { flight, pnrs } = await flightWithTwo();
    const e = event(flight, pnrs[0], 'passenger.checked-in', Date.now());
    await feed([e]).expect(200);
    await scheduler.flush();
    const before = notices.length;
    const again = await feed([e, e]).expect(200);
    expect(again.body.results.map((r: { status: string }) => r.status)).toEqual(['duplicate', 'duplicate']);
    await scheduler.flush();
    expect(notices.length).toBe(before);
    expect(await db.getRepository(FlightEventEntity).countBy({ flightId: flight.id })).toBe(1);
  });
});

describe('batches', () => {
  it('applies a batch in one go, each event alone: a rejected one and a repeated id change nothing, the rest stand', async () => {
    const { flight, pnrs } = await flightWithTwo();
    const now = Date.now();
    const good = event(flight, pnrs[0], 'passenger.checked-in', now);
    const unknownPnr = event(flight, 'NOPNR1', 'passenger.checked-in', now);
    const res = await feed([good, unknownPnr, { ...good }, { type: 'passenger.checked-in' }, event(flight, pnrs[1], 'passenger.checked-in', now)]).expect(200);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual(['applied', 'rejected', 'duplicate', 'rejected', 'applied']);
    expect(res.body.results[1].message).toContain('pnr');
    expect(res.body.results[3].details[0].field).toBe('id');
    const rows = await db.getRepository(PassengerEntity).findBy({ flightId: flight.id });
    expect(rows.map((p) => p.status)).toEqual(['checked-in', 'checked-in']);
    expect(await db.getRepository(FlightEventEntity).countBy({ flightId: flight.id })).toBe(2);
  });
});

describe('versions and reads', () => {
  it('a recompute that read earlier cannot overwrite figures read later', async () => {
    const { flight, pnrs } = await flightWithTwo();
    const early = (await readFlightState(db, flight.id))!;
    await new Promise((r) => setTimeout(r, 5)); // the database clock moves on (millisecond precision)
    await feed([event(flight, pnrs[0], 'passenger.checked-in', Date.now()), event(flight, pnrs[1], 'passenger.checked-in', Date.now())]).expect(200);
    await scheduler.flush();
    const newer = (await storedRow(flight.id))!;
    expect(newer.version).toBeGreaterThanOrEqual(1);
    expect(await writeIfNewer(db, early)).toBeNull();
    const after = (await storedRow(flight.id))!;
    expect(after.version).toBe(newer.version);
    expect(after.computedAt.getTime()).toBe(newer.computedAt.getTime());
    expect((after.detail as { cabins: { checkedIn: number }[] }).cabins[0].checkedIn).toBe(2);
  });

  it('desk reads never write, and answer 304 to the version the console holds', async () => {
    const { flight } = await flightWithTwo();
    for (const path of ['', '/passengers', '/events', '/forecast-history']) {
      const res = await agent.get(`/api/flights/${flight.id}${path}`).expect(200);
      expect(res.body.version).toBe(0);
      const etag = res.headers.etag;
      expect(etag).toBe(`"${flight.id}.0.${path ? { '/passengers': 'passengers', '/events': 'events', '/forecast-history': 'history' }[path] : 'desk'}"`);
      await agent.agent.get(`/api/flights/${flight.id}${path}`).set('If-None-Match', etag).expect(304);
    }
    expect(await storedRow(flight.id)).toBeNull();
  });

  it('a signed-out caller gets 401 from the live reads, before any payload', async () => {
    const { flight } = await flightWithTwo();
    const stranger = await request(app).get(`/api/flights/${flight.id}`);
    expect(stranger.status).toBe(401);
  });
});

describe('the apply step: replays, duplicates and order', () => {
  it('ends in the state of each passenger’s newest event, whatever the order and repeats of delivery', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.record({ who: fc.integer({ min: 0, max: 1 }), checkIn: fc.boolean(), minute: fc.integer({ min: 0, max: 50 }) }), { minLength: 1, maxLength: 6 }),
        fc.array(fc.nat(), { maxLength: 4 }),
        fc.integer(),
        async (specs, repeats, seed) => {
          const { flight, pnrs } = await flightWithTwo();
          const base = Date.now() - 3_600_000;
          // Distinct times per passenger, so "newest" is well defined.
          const seen = new Set<string>();
          const events = specs.filter((s) => !seen.has(`${s.who}:${s.minute}`) && seen.add(`${s.who}:${s.minute}`))
            .map((s) => ({ s, e: event(flight, pnrs[s.who], s.checkIn ? 'passenger.checked-in' : 'check-in.cancelled', base + s.minute * 60_000) }));
          const shuffled = [...events].sort((a, b) => ((a.e.id.length * 31 + seed) % 7) - ((b.e.id.length * 31 + seed) % 7) || (seed % 2 ? 1 : -1) * a.e.id.localeCompare(b.e.id));
          const delivered = [...shuffled, ...repeats.map((r) => shuffled[r % shuffled.length])];
          for (const d of delivered) await feed([d.e]).expect(200);
          const rows = await db.getRepository(PassengerEntity).find({ where: { flightId: flight.id }, order: { lastName: 'ASC' } });
          for (const who of [0, 1]) {
            const newest = events.filter((x) => x.s.who === who).sort((a, b) => b.s.minute - a.s.minute)[0];
            expect(rows[who].status).toBe(newest ? (newest.s.checkIn ? 'checked-in' : 'booked') : 'booked');
          }
          expect(await db.getRepository(FlightEventEntity).countBy({ flightId: flight.id })).toBe(events.length);
        },
      ),
      { numRuns: 8 },
    );
  });
});
