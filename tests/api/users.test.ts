// User administration: creating, changing and deactivating users, the limits on what an admin may grant, and the
// append-only audit trail. Every change here is made by an admin created for this run, never by a shared demo user.
// Outside sources, from memory: OWASP Authorization Cheat Sheet (least privilege: grant no more than you hold);
// OWASP Logging Cheat Sheet (record who changed what; never log password hashes; protect the log from tampering).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { userSchema } from '@shared/schemas/users';
import { AuditLogEntity } from '../../server/src/db/entities';
import { Client, startTestApp, type TestApp } from './harness';
import { RUN_ID, TEST_PASSWORD, foreignStation, insertUser, removeRunUsers, sessionRowsOf, stationIdByIata, uniqueEmail } from './helpers';

let t: TestApp;
let admin: Client;
let adminId: number;
let station: { BOS: number; FCO: number; YUL: number; foreign: number };

beforeAll(async () => {
  t = await startTestApp();
  station = {
    BOS: await stationIdByIata(t.db, 'BOS'),
    FCO: await stationIdByIata(t.db, 'FCO'),
    YUL: await stationIdByIata(t.db, 'YUL'),
    foreign: (await foreignStation(t.db)).id,
  };
  // Holds BOS and FCO but not YUL, so a real, existing station is still one this admin may not grant.
  const adminUser = await insertUser(t.db, { label: 'admin', role: 'admin', stationIds: [station.BOS, station.FCO] });
  adminId = adminUser.id;
  admin = await signInAs(adminUser.email);
});
afterAll(async () => {
  await removeRunUsers(t.db);
  await t.close();
});

async function signInAs(email: string, password = TEST_PASSWORD): Promise<Client> {
  const c = new Client(t.app);
  const res = await c.signIn(email, password);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return c;
}

const validBody = (overrides: Record<string, unknown> = {}) => ({
  email: uniqueEmail('created'),
  displayName: `Created in run ${RUN_ID}`,
  role: 'agent',
  stationIds: [station.BOS],
  password: TEST_PASSWORD,
  ...overrides,
});

/** Everything this run could have stored: its users (every run e-mail carries RUN_ID) and audit rows naming them. */
async function runRows(): Promise<{ users: number; audit: number }> {
  const like = `%${RUN_ID}%`;
  const [{ users }] = await t.db.query('SELECT COUNT(*) AS users FROM users WHERE email LIKE ? OR display_name LIKE ?', [like, like]);
  const [{ audit }] = await t.db.query(`SELECT COUNT(*) AS audit FROM audit_log WHERE entity_type = 'user' AND JSON_SEARCH(\`after\`, 'one', ?) IS NOT NULL`, [like]);
  return { users: Number(users), audit: Number(audit) };
}

const auditRowsFor = (userId: number) => t.db.getRepository(AuditLogEntity).find({ where: { entityType: 'user', entityId: String(userId) }, order: { id: 'ASC' } });

describe('creating a user', () => {
  it('answers 201 with the user, who can then sign in with the password given', async () => {
    const body = validBody({ role: 'supervisor', stationIds: [station.FCO, station.BOS] });
    const before = await runRows();
    const res = await admin.post('/api/users', { ...body, email: body.email.toUpperCase() });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // Also shows that runRows sees a stored user and its audit row, so its "nothing stored" checks below mean something.
    expect(await runRows()).toEqual({ users: before.users + 1, audit: before.audit + 1 });
    const user = userSchema.parse(res.body);
    expect(user).toMatchObject({ email: body.email, role: 'supervisor', active: true });
    expect(user.stations.map((s) => s.iata)).toEqual(['BOS', 'FCO']);
    expect(JSON.stringify(res.body)).not.toMatch(/scrypt|password/i);

    const session = await (await signInAs(body.email)).get('/api/auth/session').expect(200);
    expect(session.body.user).toMatchObject({ id: user.id, role: 'supervisor' });
  });

  it('refuses an e-mail that is already taken, in any letter case, with 409', async () => {
    const body = validBody();
    await admin.post('/api/users', body).expect(201);
    for (const email of [body.email, body.email.toUpperCase()]) {
      const res = await admin.post('/api/users', { ...body, email });
      expect(res.status).toBe(409);
      expect(res.body.error).toBe('email_taken');
    }
  });

  it('answers two simultaneous creates of one e-mail with one 201 and one 409, never a server error', async () => {
    const body = validBody();
    const answers = await Promise.all([admin.post('/api/users', body), admin.post('/api/users', body)]);
    expect(answers.map((r) => r.status).sort()).toEqual([201, 409]);
  });

  it.each([
    ['email', { email: `not-an-address-${RUN_ID}` }, 'email must be an e-mail address'],
    ['displayName', { displayName: '   ' }, 'displayName is required'],
    ['role', { role: 'pilot' }, 'role must be one of agent, supervisor, finance, admin'],
    ['stationIds', { stationIds: [] }, 'stationIds must name at least one station'],
    // 12 characters minimum: OWASP Authentication Cheat Sheet, password length (from memory).
    ['password', { password: 'elevenchars' }, 'password must be at least 12 characters'],
  ])('refuses a bad %s with 400 naming the field and rule, storing nothing', async (field, overrides, rule) => {
    const before = await runRows();
    const res = await admin.post('/api/users', validBody(overrides));
    expect(res.status).toBe(400);
    expect(res.body.details).toContainEqual({ field, rule });
    expect(await runRows()).toEqual(before);
  });

  it('names every bad field at once', async () => {
    const before = await runRows();
    const res = await admin.post('/api/users', { email: 'x', displayName: '', role: 'pilot', stationIds: [], password: 'short' });
    expect(res.status).toBe(400);
    const fields = res.body.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['email', 'displayName', 'role', 'stationIds', 'password']));
    expect(await runRows()).toEqual(before);
  });

  it.each([
    ['a demo station the admin does not hold', () => [station.YUL]],
    ['a station of another network', () => [station.foreign]],
    ['one foreign station among the admin’s own', () => [station.BOS, station.YUL]],
  ])('refuses to grant %s with 403, storing nothing', async (_name, ids) => {
    const before = await runRows();
    const res = await admin.post('/api/users', validBody({ stationIds: ids() }));
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('forbidden');
    expect(await runRows()).toEqual(before);
  });
});

describe('changing a user', () => {
  it('changes the role, and the user’s live session has the new role at its next request', async () => {
    const user = await insertUser(t.db, { label: 'promoted', role: 'agent', stationIds: [station.BOS] });
    const theirs = await signInAs(user.email);
    await theirs.get(`/api/departures?stationId=${station.BOS}`).expect(200);

    const res = await admin.patch(`/api/users/${user.id}`, { role: 'finance' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('finance');
    expect((await theirs.get('/api/auth/session')).body.user.role).toBe('finance');
    expect((await theirs.get(`/api/departures?stationId=${station.BOS}`)).status).toBe(403);
  });

  it('refuses to grant a station the admin does not hold (403) and leaves the user unchanged', async () => {
    const user = await insertUser(t.db, { label: 'not-granted', role: 'agent', stationIds: [station.BOS] });
    const res = await admin.patch(`/api/users/${user.id}`, { stationIds: [station.BOS, station.YUL] });
    expect(res.status).toBe(403);
    const list = await admin.get('/api/users').expect(200);
    const stored = list.body.users.find((u: { id: number }) => u.id === user.id);
    expect(stored.stations.map((s: { iata: string }) => s.iata)).toEqual(['BOS']);
  });

  // OWASP ASVS 5.0 V8.2.2 (from memory): data-specific access; a station admin manages only users wholly inside their stations.
  it('refuses to change a user who also holds a station the admin does not, changing nothing', async () => {
    const user = await insertUser(t.db, { label: 'shared', role: 'agent', stationIds: [station.BOS, station.YUL] });
    const res = await admin.patch(`/api/users/${user.id}`, { stationIds: [station.FCO] });
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('forbidden');
    const list = await admin.get('/api/users').expect(200);
    const shown = list.body.users.find((u: { id: number }) => u.id === user.id);
    expect(shown).toMatchObject({ manageable: false, otherStations: 1 });
    expect(shown.stations.map((s: { iata: string }) => s.iata)).toEqual(['BOS']);
  });

  it.each([
    ['deactivate themselves', { active: false }, 'active'],
    ['drop their own admin role', { role: 'agent' }, 'role'],
  ])('does not let an admin %s (400 naming the field)', async (_name, body, field) => {
    const res = await admin.patch(`/api/users/${adminId}`, body);
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { field: string }) => d.field)).toEqual([field]);
    expect((await admin.get('/api/auth/session')).body.user).toMatchObject({ id: adminId, role: 'admin' });
  });

  it('ends the user’s sessions when an admin sets a new password', async () => {
    const user = await insertUser(t.db, { label: 'reset', role: 'agent', stationIds: [station.BOS] });
    const theirs = await signInAs(user.email);
    await admin.patch(`/api/users/${user.id}`, { password: 'a-brand-new-password-7' }).expect(200);
    expect(await sessionRowsOf(t.db, user.id)).toBe(0);
    expect((await theirs.get('/api/stations')).status).toBe(401);
    await signInAs(user.email, 'a-brand-new-password-7');
  });
});

describe('audit trail', () => {
  it('records create, update and deactivate with the acting admin, before and after, and no password hash', async () => {
    const created = await admin.post('/api/users', validBody({ role: 'agent' })).expect(201);
    const id: number = created.body.id;
    await admin.patch(`/api/users/${id}`, { role: 'supervisor', password: 'another-long-password' }).expect(200);
    await admin.patch(`/api/users/${id}`, { active: false }).expect(200);

    const rows = await auditRowsFor(id);
    expect(rows.map((r) => r.action)).toEqual(['user.created', 'user.updated', 'user.deactivated']);
    for (const r of rows) expect(r).toMatchObject({ actorUserId: adminId, entityType: 'user', entityId: String(id) });
    expect(rows[0].before).toBeNull();
    expect(rows[0].after).toMatchObject({ id, role: 'agent', active: true });
    expect(rows[1].before).toMatchObject({ role: 'agent' });
    expect(rows[1].after).toMatchObject({ role: 'supervisor', passwordChanged: true });
    expect(rows[2].before).toMatchObject({ active: true });
    expect(rows[2].after).toMatchObject({ active: false });
    expect(JSON.stringify(rows)).not.toMatch(/scrypt\$|passwordHash|password_hash|another-long-password/);
  });

  it('refuses UPDATE and DELETE on the audit log at the database', async () => {
    const created = await admin.post('/api/users', validBody()).expect(201);
    const [row] = await auditRowsFor(created.body.id);
    await expect(t.db.query(`UPDATE audit_log SET action = 'tampered' WHERE id = ?`, [row.id])).rejects.toThrow(/append-only/);
    await expect(t.db.query('DELETE FROM audit_log WHERE id = ?', [row.id])).rejects.toThrow(/append-only/);
    const [after] = await auditRowsFor(created.body.id);
    expect(after).toEqual(row);
  });
});
