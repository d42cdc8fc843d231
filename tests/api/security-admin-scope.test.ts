// Who an admin may manage. A station admin manages only users whose stations all lie within the admin's own, so the
// admin of one station cannot take over an account another station relies on; a carrier-wide admin is an explicit
// grant that reaches everyone. A station admin's list shows only their own stations' part of each user.
// Yardstick: OWASP ASVS 5.0 V8.2.2 (data-specific access: users reach only what they are allowed) and V8.2.1
// (function-level access), requirement numbers from memory; OWASP Authorization Cheat Sheet (least privilege).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { userListSchema } from '@shared/schemas/users';
import { UserEntity } from '../../server/src/db/entities';
import { verifyPassword } from '../../server/src/modules/auth/password';
import { Client, startTestApp, type TestApp } from './harness';
import { TEST_PASSWORD, insertUser, removeRunUsers, stationIdByIata, uniqueEmail } from './helpers';

let t: TestApp;
let BOS: number;
let FCO: number;
let YUL: number;
let stationAdmin: Client;
let carrierAdmin: Client;

async function signInAs(email: string) {
  const c = new Client(t.app);
  expect((await c.signIn(email, TEST_PASSWORD)).status).toBe(200);
  return c;
}
const stored = (id: number) => t.db.getRepository(UserEntity).findOneOrFail({ where: { id }, relations: { stations: true } });
const iatas = (u: { stations: { iata: string }[] }) => u.stations.map((s) => s.iata).sort();

beforeAll(async () => {
  t = await startTestApp();
  [BOS, FCO, YUL] = [await stationIdByIata(t.db, 'BOS'), await stationIdByIata(t.db, 'FCO'), await stationIdByIata(t.db, 'YUL')];
  stationAdmin = await signInAs((await insertUser(t.db, { label: 'bos-fco-admin', role: 'admin', stationIds: [BOS, FCO] })).email);
  // Holds one station only: carrier-wide reach comes from the flag, not from the stations held.
  const carrier = await insertUser(t.db, { label: 'carrier-admin', role: 'admin', stationIds: [YUL] });
  await t.db.query('UPDATE users SET carrier_wide = 1 WHERE id = ?', [carrier.id]);
  carrierAdmin = await signInAs(carrier.email);
});
afterAll(async () => {
  await removeRunUsers(t.db);
  await t.close();
});

describe('a station admin and a user who also works elsewhere', () => {
  it.each([
    ['reset their password', () => ({ password: 'a-takeover-password-1' })],
    ['change their role', () => ({ role: 'admin' })],
    ['deactivate them', () => ({ active: false })],
    ['change their stations', () => ({ stationIds: [BOS] })],
    ['rename them', () => ({ displayName: 'Renamed from another station' })],
  ])('may not %s: 403, nothing changed', async (_name, makeBody) => {
    const body = makeBody();
    const shared = await insertUser(t.db, { label: 'bos-yul', role: 'agent', stationIds: [BOS, YUL] });
    const before = await stored(shared.id);
    const res = await stationAdmin.patch(`/api/users/${shared.id}`, body);
    expect(res.status).toBe(403);
    expect(res.body).toMatchObject({ error: 'forbidden', message: expect.stringMatching(/carrier-wide admin/) });
    const after = await stored(shared.id);
    expect({ ...after, updatedAt: null }).toEqual({ ...before, updatedAt: null });
    expect(await verifyPassword(TEST_PASSWORD, after.passwordHash)).toBe(true);
  });

  it('sees only the part of the user at the admin’s own stations, and that the rest is out of reach', async () => {
    const shared = await insertUser(t.db, { label: 'bos-yul-listed', role: 'agent', stationIds: [BOS, YUL] });
    const list = userListSchema.parse((await stationAdmin.get('/api/users').expect(200)).body);
    const shown = list.users.find((u) => u.id === shared.id);
    expect(shown).toMatchObject({ manageable: false, otherStations: 1, carrierWide: false });
    expect(iatas(shown!)).toEqual(['BOS']);
    expect(list.viewer).toEqual({ carrierWide: false });
    expect(JSON.stringify(list)).not.toContain('YUL');
  });

  it('still manages a user wholly inside the admin’s stations, and may move them among those stations only', async () => {
    const own = await insertUser(t.db, { label: 'bos-only', role: 'agent', stationIds: [BOS] });
    const moved = await stationAdmin.patch(`/api/users/${own.id}`, { stationIds: [FCO], role: 'supervisor' });
    expect(moved.status).toBe(200);
    expect(moved.body).toMatchObject({ role: 'supervisor', manageable: true, otherStations: 0 });
    expect(iatas(await stored(own.id))).toEqual(['FCO']);
    expect((await stationAdmin.patch(`/api/users/${own.id}`, { stationIds: [FCO, YUL] })).status).toBe(403);
    expect(iatas(await stored(own.id))).toEqual(['FCO']);
  });

  it('answers 404 for a user with no station in common, revealing nothing', async () => {
    const elsewhere = await insertUser(t.db, { label: 'yul-only', role: 'agent', stationIds: [YUL] });
    const res = await stationAdmin.patch(`/api/users/${elsewhere.id}`, { displayName: 'x' });
    expect([res.status, res.body.error]).toEqual([404, 'not_found']);
  });
});

describe('carrier-wide admin', () => {
  it('is out of reach of a station admin, even at the station admin’s own stations', async () => {
    const other = await insertUser(t.db, { label: 'carrier-at-bos', role: 'admin', stationIds: [BOS] });
    await t.db.query('UPDATE users SET carrier_wide = 1 WHERE id = ?', [other.id]);
    const res = await stationAdmin.patch(`/api/users/${other.id}`, { password: 'a-takeover-password-2' });
    expect(res.status).toBe(403);
    expect(await verifyPassword(TEST_PASSWORD, (await stored(other.id)).passwordHash)).toBe(true);
  });

  it('may be granted only by a carrier-wide admin', async () => {
    const body = { email: uniqueEmail('new-carrier'), displayName: 'New carrier admin', role: 'admin', stationIds: [BOS], password: TEST_PASSWORD, carrierWide: true };
    expect((await stationAdmin.post('/api/users', body)).status).toBe(403);
    const own = await insertUser(t.db, { label: 'promote', role: 'admin', stationIds: [BOS] });
    expect((await stationAdmin.patch(`/api/users/${own.id}`, { carrierWide: true })).status).toBe(403);
    expect((await stored(own.id)).carrierWide).toBe(false);
    const created = await carrierAdmin.post('/api/users', body);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ carrierWide: true });
  });

  it('is for admins only: a 400 naming carrierWide for any other role', async () => {
    const res = await carrierAdmin.post('/api/users', { email: uniqueEmail('carrier-agent'), displayName: 'x', role: 'agent', stationIds: [BOS], password: TEST_PASSWORD, carrierWide: true });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ field: 'carrierWide', rule: 'only an admin can be carrier-wide' }]);
  });

  it('sees every station of every user and manages a user of several stations', async () => {
    const shared = await insertUser(t.db, { label: 'bos-fco-yul', role: 'agent', stationIds: [BOS, FCO, YUL] });
    const list = userListSchema.parse((await carrierAdmin.get('/api/users').expect(200)).body);
    expect(list.viewer).toEqual({ carrierWide: true });
    expect(list.users.find((u) => u.id === shared.id)).toMatchObject({ manageable: true, otherStations: 0 });
    const res = await carrierAdmin.patch(`/api/users/${shared.id}`, { stationIds: [FCO], password: 'a-proper-reset-password' });
    expect(res.status).toBe(200);
    expect(iatas(await stored(shared.id))).toEqual(['FCO']);
  });
});
