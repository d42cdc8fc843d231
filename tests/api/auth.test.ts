// Sign-in, sign-out, CSRF and deactivation, run against the real app and the test database.
// Outside sources for the expected behaviour (all from memory): OWASP Authentication Cheat Sheet (generic failure
// answers, "authentication responses" section), OWASP Session Management Cheat Sheet (renew the session id at
// sign-in, HttpOnly and SameSite cookies, end the session server-side at sign-out), OWASP Cross-Site Request
// Forgery Prevention Cheat Sheet (synchronizer token pattern: one token per session, refused when absent or wrong).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { sessionResponseSchema } from '@shared/schemas/auth';
import { UserEntity } from '../../server/src/db/entities';
import { Client, DEMO_PASSWORD, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, TEST_PASSWORD, insertUser, removeRunUsers, sessionCookie, sessionIdFrom, sessionRowsOf, stationIdByIata, uniqueEmail } from './helpers';

let t: TestApp;
let bosId: number;

beforeAll(async () => {
  t = await startTestApp();
  bosId = await stationIdByIata(t.db, 'BOS');
});
afterAll(async () => {
  await removeRunUsers(t.db);
  await t.close();
});

const cookiePair = (setCookie: string) => setCookie.split(';')[0];

async function storedSessions(sessionId: string): Promise<number> {
  const [{ n }] = await t.db.query('SELECT COUNT(*) AS n FROM sessions WHERE session_id = ?', [sessionId]);
  return Number(n);
}

describe('sign-in', () => {
  it('returns the signed-in user and a new CSRF token; the pre-sign-in token stops working', async () => {
    const c = new Client(t.app);
    const before = await c.refreshCsrf();
    expect(before.user).toBeNull();

    const res = await c.agent.post('/api/auth/sign-in').set('X-CSRF-Token', before.csrfToken).send({ email: DEMO.agent, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    const body = sessionResponseSchema.parse(res.body);
    expect(body.user).toMatchObject({ email: DEMO.agent, role: 'agent' });
    expect(body.user?.stations.map((s) => s.iata)).toEqual(['BOS', 'FCO', 'YUL']);
    expect(JSON.stringify(res.body)).not.toMatch(/scrypt|passwordHash|password_hash/);
    expect(body.csrfToken).not.toBe(before.csrfToken);

    const stale = await c.agent.post('/api/auth/sign-out').set('X-CSRF-Token', before.csrfToken);
    expect(stale.status).toBe(403);
    const session = await c.get('/api/auth/session').expect(200);
    expect(session.body).toMatchObject({ user: { email: DEMO.agent }, csrfToken: body.csrfToken });
  });

  it('treats the e-mail without regard to letter case', async () => {
    const res = await new Client(t.app).signIn(DEMO.supervisor.toUpperCase());
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(DEMO.supervisor);
  });

  // OWASP ASVS 5.0 V7.2.4 (from memory): a new session token is issued at authentication.
  it('issues a new session id at sign-in, so a planted session cookie is worthless (session fixation)', async () => {
    // Nothing is stored before sign-in, so the only session id an attacker can plant is one of their own.
    const attacker = await signedIn(t, DEMO.agent);
    const planted = await attacker.get('/api/auth/session').expect(200);
    const plantedCookie = cookiePair(sessionCookie(planted) ?? '');
    expect(plantedCookie).not.toBe('');

    const victim = new Client(t.app);
    const pre = await victim.agent.get('/api/auth/session').set('Cookie', plantedCookie).expect(200);
    const res = await victim.agent.post('/api/auth/sign-in').set('Cookie', [plantedCookie, ...((pre.headers['set-cookie'] as unknown as string[] | undefined) ?? []).map(cookiePair)].join('; ')).set('X-CSRF-Token', pre.body.csrfToken).send({ email: DEMO.finance, password: DEMO_PASSWORD });
    expect(res.status, JSON.stringify(res.body)).toBe(200);

    expect(sessionIdFrom(res)).not.toBe(sessionIdFrom(planted));
    // The planted id still belongs to the attacker, never to the finance user who signed in on top of it.
    const replay = await request(t.app).get('/api/auth/session').set('Cookie', plantedCookie);
    expect(replay.body.user?.email).not.toBe(DEMO.finance);
    expect(await storedSessions(sessionIdFrom(res))).toBe(1);
  });

  it('sets the session cookie HttpOnly and SameSite=Lax, expiring after the 30-minute idle limit', async () => {
    const res = await new Client(t.app).signIn(DEMO.agent);
    const cookie = sessionCookie(res) ?? '';
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    expect(cookie).toMatch(/;\s*Path=\//i);
    // 30 minutes is the configured default (SESSION_IDLE_MINUTES); OWASP suggests 15–30 minutes for low-risk apps (from memory).
    const expires = Date.parse(/Expires=([^;]+)/i.exec(cookie)?.[1] ?? '');
    const sent = Date.parse(String(res.headers.date));
    expect(Math.abs(expires - sent - 30 * 60_000)).toBeLessThanOrEqual(2_000);
  });
});

describe('failed sign-in', () => {
  it('answers an unknown e-mail exactly like a wrong password: same status, same body', async () => {
    const wrongPassword = await new Client(t.app).signIn(DEMO.agent, 'not-the-demo-password');
    const unknownEmail = await new Client(t.app).signIn(uniqueEmail('nobody'), 'not-the-demo-password');
    expect(wrongPassword.status).toBe(401);
    expect(unknownEmail.status).toBe(wrongPassword.status);
    expect(unknownEmail.body).toEqual(wrongPassword.body);
    expect(wrongPassword.body).toEqual({ error: 'sign_in_failed', message: expect.any(String) });
  });
});

// OWASP ASVS 5.0 V7.4.1 (sign-out ends the session on the server), number from memory.
describe('sign-out', () => {
  it('ends the session on the server: the next protected call is 401 and the old cookie is worthless', async () => {
    const c = await signedIn(t, DEMO.supervisor);
    const live = await c.get('/api/stations').expect(200);
    const liveCookie = cookiePair(sessionCookie(live) ?? '');
    const sessionId = sessionIdFrom(live);

    const out = await c.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect(sessionCookie(out)).toMatch(/Expires=Thu, 01 Jan 1970/);

    const next = await c.get('/api/stations');
    expect(next.status).toBe(401);
    expect(next.body.error).toBe('not_signed_in');
    expect(await storedSessions(sessionId)).toBe(0);
    const replay = await request(t.app).get('/api/stations').set('Cookie', liveCookie);
    expect(replay.status).toBe(401);
  });
});

// OWASP ASVS 5.0 V3.5.1 (cross-site request forgery defences), number from memory.
describe('CSRF synchronizer token', () => {
  const credentials = { email: DEMO.agent, password: DEMO_PASSWORD };

  it('refuses sign-in without a token', async () => {
    const c = new Client(t.app);
    await c.refreshCsrf();
    const res = await c.agent.post('/api/auth/sign-in').send(credentials);
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('csrf_token_invalid');
  });

  it('refuses sign-in with a wrong token', async () => {
    const c = new Client(t.app);
    await c.refreshCsrf();
    const res = await c.agent.post('/api/auth/sign-in').set('X-CSRF-Token', 'f'.repeat(256)).send(credentials);
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('csrf_token_invalid');
  });

  it('refuses a token that belongs to another session', async () => {
    const victim = new Client(t.app);
    await victim.refreshCsrf();
    const attacker = new Client(t.app);
    await attacker.refreshCsrf();
    const res = await attacker.agent.post('/api/auth/sign-in').set('X-CSRF-Token', victim.csrf).send(credentials);
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('csrf_token_invalid');
  });

  it.each([
    ['without a token', undefined],
    ['with a wrong token', 'wrong-token'],
  ])('refuses a PATCH %s and changes nothing', async (_name, token) => {
    const admin = await signedIn(t, DEMO.admin);
    const target = await insertUser(t.db, { label: 'csrf', role: 'agent', stationIds: [bosId] });
    const forged = admin.agent.patch(`/api/users/${target.id}`);
    if (token) forged.set('X-CSRF-Token', token);
    const res = await forged.send({ displayName: 'Renamed by a forged request' });
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('csrf_token_invalid');
    const stored = await t.db.getRepository(UserEntity).findOneByOrFail({ id: target.id });
    expect(stored.displayName).toBe(target.displayName);
    // The same call with the session's token goes through, so the refusal above was the token and nothing else.
    await admin.patch(`/api/users/${target.id}`, { displayName: 'Renamed properly' }).expect(200);
  });
});

// OWASP ASVS 5.0 V7.4.2 (a disabled account's sessions end at once), number from memory.
describe('deactivation', () => {
  it("ends every live session of the user at once and refuses their next sign-in like a wrong password", async () => {
    const user = await insertUser(t.db, { label: 'deactivated', role: 'agent', stationIds: [bosId] });
    const laptop = new Client(t.app);
    const phone = new Client(t.app);
    expect((await laptop.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
    expect((await phone.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
    await laptop.get('/api/stations').expect(200);
    expect(await sessionRowsOf(t.db, user.id)).toBe(2);

    const admin = await signedIn(t, DEMO.admin);
    await admin.patch(`/api/users/${user.id}`, { active: false }).expect(200);

    expect(await sessionRowsOf(t.db, user.id)).toBe(0);
    expect((await laptop.get('/api/stations')).status).toBe(401);
    expect((await phone.get('/api/stations')).status).toBe(401);
    const again = await new Client(t.app).signIn(user.email, TEST_PASSWORD);
    const wrongPassword = await new Client(t.app).signIn(DEMO.agent, 'not-the-demo-password');
    expect(again.status).toBe(401);
    expect(again.body).toEqual(wrongPassword.body);
  });
});

describe('sign-in input', () => {
  async function postSignIn(send: (r: request.Test) => request.Test) {
    const c = new Client(t.app);
    await c.refreshCsrf();
    return send(c.agent.post('/api/auth/sign-in').set('X-CSRF-Token', c.csrf));
  }
  const fields = (res: request.Response) => (res.body.details ?? []).map((d: { field: string }) => d.field);

  it.each([
    ['a missing email', { password: 'anything-at-all' }, 'email'],
    ['an email that is not an e-mail address', { email: 'agent-at-bumpboard', password: 'anything-at-all' }, 'email'],
    ['an empty password', { email: DEMO.agent, password: '' }, 'password'],
    ['a missing password', { email: DEMO.agent }, 'password'],
    ['a password that is not text', { email: DEMO.agent, password: 12345 }, 'password'],
  ])('refuses %s with 400 naming the field', async (_name, body, field) => {
    const res = await postSignIn((r) => r.send(body));
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('invalid_request');
    expect(fields(res)).toContain(field);
    expect(res.body.message).toContain(field);
  });

  it('refuses a body that is not JSON with 400 naming both fields', async () => {
    const res = await postSignIn((r) => r.set('Content-Type', 'text/plain').send(`email=${DEMO.agent}&password=x`));
    expect(res.status).toBe(400);
    expect(fields(res)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('refuses malformed JSON with 400 naming the body', async () => {
    const res = await postSignIn((r) => r.set('Content-Type', 'application/json').send('{"email": "agent@'));
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('malformed_json');
    expect(fields(res)).toEqual(['body']);
  });
});
