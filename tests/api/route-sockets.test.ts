// The socket half of the role × route × station table: every event a client may send has a row saying who may use
// it and for which station, read from the handlers the server really registers on a connection, so a new event
// without a row fails; every event the server sends reaches only the rooms of the caller's own stations.
// Outside source, from memory: OWASP ASVS 5.0 V4 (WebSocket: authenticate the connection, authorize every message)
// and V8 (authorization on every request and message), level 2.
import { createServer, type Server as HttpServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { io as connect, type Socket } from 'socket.io-client';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { SOCKET_EVENTS } from '@shared/events';
import { DENIAL_DESK_ROLES, ROLES, type Role } from '@shared/schemas/common';
import { loadEnv } from '../../server/src/config/env';
import { FlightEntity } from '../../server/src/db/entities';
import { createSessionSetup, type SessionSetup } from '../../server/src/http/session';
import { socketPublisher } from '../../server/src/realtime/publisher';
import { createSocketServer, type AppIo } from '../../server/src/realtime/socket-server';
import { DEMO_PASSWORD, startTestApp, type TestApp } from './harness';
import { DEMO, foreignStation, stationIdByIata } from './helpers';

type Scope = 'own' | 'other';
interface Ctx { station: Record<Scope, number>; flight: Record<Scope, number> }

/** A client → server event: who may send it, what it names, and whether the server answers (ack). */
interface SocketRow {
  event: string;
  access: readonly Role[];
  args(ctx: Ctx, scope: Scope): unknown[];
  /** The room the event opens to the caller: a server → client event delivered there proves the join. */
  delivers?: { event: string; publish(ctx: Ctx, scope: Scope): [number, number] };
  acks: boolean;
}

const SOCKET_ROWS: readonly SocketRow[] = [
  {
    event: SOCKET_EVENTS.watchStation, access: ROLES, acks: true,
    args: (ctx, scope) => [ctx.station[scope]],
    delivers: { event: SOCKET_EVENTS.stationChanged, publish: (ctx, scope) => [ctx.flight[scope], ctx.station[scope]] },
  },
  {
    event: SOCKET_EVENTS.watchFlight, access: ROLES, acks: true,
    args: (ctx, scope) => [ctx.flight[scope]],
    delivers: { event: SOCKET_EVENTS.flightChanged, publish: (ctx, scope) => [ctx.flight[scope], ctx.station[scope]] },
  },
  { event: SOCKET_EVENTS.unwatchFlight, access: ROLES, acks: false, args: (ctx, scope) => [ctx.flight[scope]] },
];

/** socket.io's own lifecycle listeners: no client can send these as messages. */
const LIFECYCLE = new Set(['error', 'disconnect', 'disconnecting', 'newListener', 'removeListener']);

/** Server → client events: sent only to a flight's or a station's room, which only the rows above can open. */
const SERVER_EVENTS = [SOCKET_EVENTS.flightChanged, SOCKET_EVENTS.stationChanged];

let t: TestApp;
let http: HttpServer;
let io: AppIo;
let session: SessionSetup;
let url: string;
let ctx: Ctx;
let registered: string[] = [];
const open: Socket[] = [];

beforeAll(async () => {
  t = await startTestApp();
  // The socket server shares the sign-in sessions the app stores, exactly as server/src/main.ts wires it.
  session = createSessionSetup(loadEnv({ ...process.env, NODE_ENV: 'test', SESSION_SECRET: process.env.SESSION_SECRET ?? 'test-secret-test-secret-test-secret-42' }));
  http = createServer(t.app);
  io = createSocketServer(http, { db: t.db, sessionMiddleware: session.middleware });
  // Registered after the server's own handler, so by now every handler of the connection is in place.
  io.on('connection', (s) => {
    registered = s.eventNames().map(String).filter((e) => !LIFECYCLE.has(e));
  });
  await new Promise<void>((r) => http.listen(0, '127.0.0.1', r));
  url = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
  const bos = await stationIdByIata(t.db, 'BOS');
  const other = await foreignStation(t.db);
  const ownFlight = await t.db.getRepository(FlightEntity).findOneByOrFail({ stationId: bos, flightNumber: '107' });
  const otherFlight = await t.db.getRepository(FlightEntity).findOneBy({ stationId: other.id });
  ctx = { station: { own: bos, other: other.id }, flight: { own: ownFlight.id, other: otherFlight?.id ?? 2_000_000_000 } };
});

afterAll(async () => {
  for (const s of open) s.disconnect();
  io?.close();
  await session?.close();
  await t.close();
});

async function cookieOf(role: Role): Promise<string> {
  const agent = request.agent(t.app);
  const { body } = await agent.get('/api/auth/session').expect(200);
  const res = await agent.post('/api/auth/sign-in').set('X-CSRF-Token', body.csrfToken).send({ email: DEMO[role], password: DEMO_PASSWORD }).expect(200);
  return (res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
}

function socketWith(cookie?: string): Promise<Socket> {
  const s = connect(url, { transports: ['websocket'], reconnection: false, extraHeaders: cookie ? { Cookie: cookie } : {} });
  open.push(s);
  return new Promise((resolve, reject) => {
    s.on('connect', () => resolve(s));
    s.on('connect_error', reject);
  });
}

const ack = (s: Socket, event: string, args: unknown[]) => s.timeout(5_000).emitWithAck(event, ...args) as Promise<{ ok: boolean }>;

describe('the socket table', () => {
  it('has a row for every event the server handles, and every row names a handled event', async () => {
    await socketWith(await cookieOf('agent'));
    await vi.waitFor(() => expect(registered.length).toBeGreaterThan(0));
    const rows = SOCKET_ROWS.map((r) => r.event);
    expect(registered.filter((e) => !rows.includes(e)), 'socket events with no row in this table').toEqual([]);
    expect(rows.filter((e) => !registered.includes(e)), 'rows naming no handled event').toEqual([]);
  });

  it('has a row for every event of the shared list, either way', () => {
    const covered = new Set([...SOCKET_ROWS.map((r) => r.event), ...SERVER_EVENTS]);
    expect(Object.values(SOCKET_EVENTS).filter((e) => !covered.has(e))).toEqual([]);
  });

  it('refuses a connection without a signed-in session', async () => {
    await expect(socketWith()).rejects.toThrow('not_signed_in');
  });
});

describe.each(SOCKET_ROWS.map((row) => [row.event, row] as const))('%s', (_event, row) => {
  it.each(row.access)('lets the %s role use it for its own station, and for another station answers no and delivers nothing', async (role) => {
    const s = await socketWith(await cookieOf(role));
    const heard: string[] = [];
    s.onAny((event: string, payload: { id: number }) => heard.push(`${event} ${payload.id}`));
    if (row.acks) {
      expect(await ack(s, row.event, row.args(ctx, 'own'))).toEqual({ ok: true });
      expect(await ack(s, row.event, row.args(ctx, 'other'))).toEqual({ ok: false });
    } else {
      s.emit(row.event, ...row.args(ctx, 'own'));
      s.emit(row.event, ...row.args(ctx, 'other'));
    }
    if (!row.delivers) return;
    const publisher = socketPublisher(() => io);
    const [otherFlight, otherStation] = row.delivers.publish(ctx, 'other');
    publisher.flightChanged(otherFlight, otherStation);
    const [ownFlight, ownStation] = row.delivers.publish(ctx, 'own');
    publisher.flightChanged(ownFlight, ownStation);
    const expected = `${row.delivers.event} ${row.delivers.event === SOCKET_EVENTS.flightChanged ? ownFlight : ownStation}`;
    await vi.waitFor(() => expect(heard).toContain(expected));
    // Sent before the own one, on the same connection: had it been delivered, it would be here already.
    const leaked = `${row.delivers.event} ${row.delivers.event === SOCKET_EVENTS.flightChanged ? otherFlight : otherStation}`;
    expect(heard).not.toContain(leaked);
    s.disconnect();
  });
});

describe(`${SOCKET_EVENTS.unwatchFlight} takes the caller out of the flight's room`, () => {
  it('delivers nothing more for that flight', async () => {
    const s = await socketWith(await cookieOf('agent'));
    const heard: string[] = [];
    s.onAny((event: string, payload: { id: number }) => heard.push(`${event} ${payload.id}`));
    expect(await ack(s, SOCKET_EVENTS.watchFlight, [ctx.flight.own])).toEqual({ ok: true });
    s.emit(SOCKET_EVENTS.unwatchFlight, ctx.flight.own);
    expect(await ack(s, SOCKET_EVENTS.watchStation, [ctx.station.own])).toEqual({ ok: true });
    // The publisher emits to the flight's room first, then the station's: the station's arriving alone proves it.
    socketPublisher(() => io).flightChanged(ctx.flight.own, ctx.station.own);
    await vi.waitFor(() => expect(heard).toContain(`${SOCKET_EVENTS.stationChanged} ${ctx.station.own}`));
    expect(heard).not.toContain(`${SOCKET_EVENTS.flightChanged} ${ctx.flight.own}`);
    s.disconnect();
  });
});

describe('the denial ranking on a forecast notice', () => {
  it.each(ROLES)('reaches the %s role only if that role works denied boarding, with the notice itself either way', async (role) => {
    const s = await socketWith(await cookieOf(role));
    const heard: { id: number; version?: number; ranking?: unknown }[] = [];
    s.on(SOCKET_EVENTS.flightChanged, (p: { id: number; version?: number; ranking?: unknown }) => heard.push(p));
    expect(await ack(s, SOCKET_EVENTS.watchFlight, [ctx.flight.own])).toEqual({ ok: true });
    socketPublisher(() => io).flightChanged(ctx.flight.own, ctx.station.own, ['forecast'], undefined, { ranking: { kind: 'same', tag: 'ranking-test' } });
    await vi.waitFor(() => expect(heard.map((p) => p.id)).toContain(ctx.flight.own));
    // One notice per console, whichever room it came through.
    expect(heard).toHaveLength(1);
    const works = (DENIAL_DESK_ROLES as readonly Role[]).includes(role);
    expect(heard[0].ranking).toEqual(works ? { kind: 'same', tag: 'ranking-test' } : undefined);
    s.disconnect();
  });
});
