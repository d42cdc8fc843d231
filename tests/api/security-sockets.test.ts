// Live connections follow the user as stored: a socket leaves the rooms of stations taken from its user at once,
// refuses to join them again, and ends with sign-out, deactivation or a new password. A handshake without a
// signed-in session is refused.
// Yardsticks: OWASP ASVS 5.0 V8.2.2 (data-specific access on every path) and V7.4.1/V7.4.2 (sign-out and account
// deactivation end the sessions), requirement numbers from memory.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect, type Socket } from 'socket.io-client';
import { flightRoom, stationRoom, type ClientToServerEvents, type ServerToClientEvents } from '@shared/events';
import { Client, startTestApp, type TestApp } from './harness';
import { TEST_PASSWORD, insertUser, removeRunUsers, sessionCookie, stationIdByIata } from './helpers';
import { makeFlight, removeFlights } from './volunteers-fixtures';

type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
let t: TestApp;
let BOS: number;
let FCO: number;
let admin: Client;
const sockets: ClientSocket[] = [];
const flightIds: number[] = [];

beforeAll(async () => {
  t = await startTestApp({ sockets: true });
  [BOS, FCO] = [await stationIdByIata(t.db, 'BOS'), await stationIdByIata(t.db, 'FCO')];
  const a = await insertUser(t.db, { label: 'socket-admin', role: 'admin', stationIds: [BOS, FCO] });
  admin = new Client(t.app);
  expect((await admin.signIn(a.email, TEST_PASSWORD)).status).toBe(200);
});
afterAll(async () => {
  for (const s of sockets) s.disconnect();
  await removeFlights(t.db, flightIds);
  await removeRunUsers(t.db);
  await t.close();
});

/** A signed-in user with an open socket, as a console in a browser would hold. */
async function liveUser(label: string, stationIds: number[]) {
  const user = await insertUser(t.db, { label, role: 'agent', stationIds });
  const c = new Client(t.app);
  const res = await c.signIn(user.email, TEST_PASSWORD);
  expect(res.status).toBe(200);
  const socket: ClientSocket = connect(t.baseUrl, { transports: ['websocket'], extraHeaders: { cookie: (sessionCookie(res) ?? '').split(';')[0] }, reconnection: false });
  sockets.push(socket);
  await new Promise<void>((resolve, reject) => {
    socket.on('connect', () => resolve());
    socket.on('connect_error', reject);
  });
  return { user, c, socket };
}

const watch = (s: ClientSocket, event: 'station:watch' | 'flight:watch', id: number) => new Promise<boolean>((r) => s.emit(event, id, (a) => r(a.ok)));
const membersOf = async (room: string) => (await t.io!.in(room).fetchSockets()).map((s) => s.id);

describe('a change of stations', () => {
  it('makes open sockets leave the removed station’s rooms at once, and refuses to join them again', async () => {
    const flight = await makeFlight(t.db, { stationId: FCO, origin: 'FCO', destination: 'CDG' });
    flightIds.push(flight.id);
    const { user, socket } = await liveUser('loses-fco', [BOS, FCO]);
    expect(await watch(socket, 'station:watch', FCO)).toBe(true);
    expect(await watch(socket, 'flight:watch', flight.id)).toBe(true);
    expect(await watch(socket, 'station:watch', BOS)).toBe(true);
    expect(await membersOf(stationRoom(FCO))).toContain(socket.id);

    await admin.patch(`/api/users/${user.id}`, { stationIds: [BOS] }).expect(200);
    await expect.poll(() => membersOf(stationRoom(FCO))).not.toContain(socket.id);
    await expect.poll(() => membersOf(flightRoom(flight.id))).not.toContain(socket.id);
    // Still at BOS, and still connected: only what was taken away is gone.
    expect(await membersOf(stationRoom(BOS))).toContain(socket.id);
    expect(socket.connected).toBe(true);
    expect(await watch(socket, 'station:watch', FCO)).toBe(false);
    expect(await watch(socket, 'flight:watch', flight.id)).toBe(false);
  });
});

describe('the end of a session', () => {
  it('disconnects the sockets at sign-out', async () => {
    const { c, socket } = await liveUser('signs-out', [BOS]);
    await c.post('/api/auth/sign-out').expect(204);
    await expect.poll(() => socket.connected).toBe(false);
  });

  it('disconnects the sockets at deactivation', async () => {
    const { user, socket } = await liveUser('deactivated', [BOS]);
    await admin.patch(`/api/users/${user.id}`, { active: false }).expect(200);
    await expect.poll(() => socket.connected).toBe(false);
  });

  it('refuses a handshake without a signed-in session', async () => {
    const anonymous: ClientSocket = connect(t.baseUrl, { transports: ['websocket'], reconnection: false });
    sockets.push(anonymous);
    const error = await new Promise<Error>((r) => anonymous.on('connect_error', r));
    expect(error.message).toBe('not_signed_in');
  });
});
