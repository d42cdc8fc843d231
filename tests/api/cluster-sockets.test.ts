// Two app "processes" (each its own database pool, session store, scheduler, HTTP and socket.io server) share one
// MariaDB and one Redis on loopback: an event posted to the first reaches a console connected to the second, and the
// second, told by the first that the flight moved, serves the new version from then on, never the older one it held.
import 'reflect-metadata';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { ChildProcess } from 'node:child_process';
import { io as connect, type Socket } from 'socket.io-client';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ChangedPayload, ClientToServerEvents, ServerToClientEvents } from '@shared/events';
import { flightDeskSchema } from '@shared/schemas/flight-desk';
import { createApp } from '../../server/src/app';
import { loadEnv } from '../../server/src/config/env';
import { createDataSource } from '../../server/src/db/data-source';
import type { FlightEntity } from '../../server/src/db/entities';
import { createSessionSetup } from '../../server/src/http/session';
import { createSignInThrottle } from '../../server/src/modules/auth/throttle';
import { createForecastScheduler, type ForecastScheduler } from '../../server/src/modules/forecast/forecast-scheduler';
import { createIntegrationKey } from '../../server/src/modules/integrations/integration-keys.service';
import { followPeers, shareThroughRedis } from '../../server/src/realtime/peers';
import { socketPublisher } from '../../server/src/realtime/publisher';
import { createSocketServer, type AppIo } from '../../server/src/realtime/socket-server';
// @ts-expect-error a plain Node script of ours, without type declarations
import { startPrivateRedis } from '../../server/scripts/lib/redis.mjs';
import { addBooking, createFlight, removeDenialFixtures } from './denials-fixtures';
import { forecastAnnouncer } from '../../server/src/modules/denials/ranking-notices';
import { Client } from './harness';
import { DEMO, RUN_ID, sessionCookie } from './helpers';

interface Node {
  db: DataSource;
  app: ReturnType<typeof createApp>;
  http: Server;
  io: AppIo;
  baseUrl: string;
  forecast: ForecastScheduler;
  close(): Promise<void>;
}

/** Redis on a loopback port of this worktree's test range (TEST_PORT + 90). */
const REDIS_PORT = Number(process.env.TEST_PORT ?? 4700) + 90;
let redis: { url: string; child: ChildProcess };
let one: Node;
let two: Node;
type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
const sockets: ClientSocket[] = [];

async function startNode(redisUrl: string): Promise<Node> {
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', SESSION_SECRET: process.env.SESSION_SECRET ?? 'test-secret-test-secret-test-secret-42', STATIC_DIR: 'none', REDIS_URL: redisUrl });
  const db = createDataSource(env.DATABASE_URL);
  await db.initialize();
  const session = createSessionSetup(env);
  const ioRef: { io?: AppIo } = {};
  const publisher = socketPublisher(() => ioRef.io);
  const forecast = createForecastScheduler(db, forecastAnnouncer(db));
  const app = createApp({ env, db, session, forecast, publisher, throttle: createSignInThrottle({ perAccount: 1000, perAddress: 10_000 }), demo: true });
  const http = createServer(app);
  const io = createSocketServer(http, { db, sessionMiddleware: session.middleware });
  ioRef.io = io;
  const closeRedis = await shareThroughRedis(io, env.REDIS_URL!);
  followPeers(io, db);
  await new Promise<void>((r) => http.listen(0, '127.0.0.1', r));
  return {
    db, app, http, io, forecast, baseUrl: `http://127.0.0.1:${(http.address() as AddressInfo).port}`,
    async close() {
      await forecast.flush();
      await io.close();
      await closeRedis();
      await session.close();
      await db.destroy();
    },
  };
}

beforeAll(async () => {
  redis = await startPrivateRedis({ port: REDIS_PORT, dir: `.local/test/redis-${REDIS_PORT}` });
  [one, two] = await Promise.all([startNode(redis.url), startNode(redis.url)]);
}, 120_000);
afterAll(async () => {
  for (const s of sockets) s.disconnect();
  await removeDenialFixtures(one.db);
  await Promise.all([one.close(), two.close()]);
  redis.child.kill('SIGTERM');
});

describe('two processes behind one Redis', () => {
  it('an event posted to one reaches a console of the other, whose reads then serve the new version', async () => {
    const flight: FlightEntity = await createFlight(one.db, { station: 'BOS', destination: 'ORD', seats: 2 });
    const { booking } = await addBooking(one.db, flight, [{ first: 'Ada', last: 'Alder', status: 'booked' }]);
    const key = (await createIntegrationKey(one.db, flight.stationId, `cluster ${RUN_ID}`, { label: 'cluster test' })).key;

    // The console signs in and connects to the second process, and reads the desk there (held in its memory).
    const agent = new Client(two.app);
    const res = await agent.signIn(DEMO.agent);
    expect(res.status).toBe(200);
    const socket: ClientSocket = connect(two.baseUrl, { transports: ['websocket'], extraHeaders: { cookie: (sessionCookie(res) ?? '').split(';')[0] }, reconnection: false });
    sockets.push(socket);
    const notices: ChangedPayload[] = [];
    socket.on('flight:changed', (p) => notices.push(p));
    await new Promise<void>((resolve, reject) => {
      socket.on('connect', () => resolve());
      socket.on('connect_error', reject);
    });
    expect(await new Promise<boolean>((r) => socket.emit('flight:watch', flight.id, (a) => r(a.ok)))).toBe(true);
    const before = flightDeskSchema.parse((await agent.get(`/api/flights/${flight.id}`).expect(200)).body);
    expect(before.totals.checkedIn).toBe(0);

    // The feed posts to the first process, which recomputes and tells the consoles, wherever they are connected.
    const event = { id: `cluster-${RUN_ID}-1`, type: 'passenger.checked-in', occurredAt: new Date().toISOString(), pnr: booking.pnr, sequence: 1, flight: { carrier: flight.carrierCode, number: flight.flightNumber, date: flight.serviceDate } };
    await request(one.app).post('/api/integrations/events').set('Authorization', `Bearer ${key}`).send({ events: [event] }).expect(200);
    await expect.poll(() => notices.find((n) => n.version === before.version + 1), { timeout: 15_000 }).toBeTruthy();
    expect(notices.filter((n) => n.version === before.version + 1)).toHaveLength(1); // once, not once per process
    expect(notices.find((n) => n.version === before.version + 1)?.desk?.totals.checkedIn).toBe(1);

    // The second process dropped the version it held: its read is the new one, not the one in its memory.
    await expect.poll(async () => flightDeskSchema.parse((await agent.get(`/api/flights/${flight.id}`).expect(200)).body).totals.checkedIn, { timeout: 10_000 }).toBe(1);
  });
});
