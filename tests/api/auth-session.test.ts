// Session lifetime (idle and absolute limits, kept in the MariaDB session store) and the hardening headers.
// Outside sources, from memory: OWASP Session Management Cheat Sheet ("Session Expiration": an idle timeout that
// restarts with activity and an absolute timeout that does not, both enforced on the server); OWASP HTTP Security
// Response Headers Cheat Sheet (nosniff, frame restrictions, CSP, HSTS, Referrer-Policy, no X-Powered-By).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, sessionIdFrom } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
// The configured defaults (SESSION_IDLE_MINUTES, SESSION_ABSOLUTE_HOURS); the harness does not override them.
const IDLE_LIMIT = 30 * MINUTE;
const ABSOLUTE_LIMIT = 12 * HOUR;

async function signedInSession(email: string) {
  const c = await signedIn(t, email);
  const res = await c.get('/api/stations').expect(200);
  return { c, sessionId: sessionIdFrom(res) };
}

async function storedExpiryMs(sessionId: string): Promise<number | undefined> {
  const rows: { expires: number }[] = await t.db.query('SELECT expires FROM sessions WHERE session_id = ?', [sessionId]);
  return rows[0] ? Number(rows[0].expires) * 1000 : undefined;
}

// OWASP ASVS 5.0 V7.3.1 (inactivity timeout enforced on the server), number from memory.
describe('idle timeout', () => {
  it('stores the idle deadline with the session on the server', async () => {
    const { sessionId } = await signedInSession(DEMO.agent);
    const expiry = await storedExpiryMs(sessionId);
    expect(expiry).toBeDefined();
    expect(Math.abs((expiry ?? 0) - Date.now() - IDLE_LIMIT)).toBeLessThan(5_000);
  });

  it('signs nobody in on a session whose idle deadline has passed, whatever the cookie says', async () => {
    const { c, sessionId } = await signedInSession(DEMO.agent);
    // What 30 quiet minutes would do to the stored row, without waiting for them.
    await t.db.query('UPDATE sessions SET expires = UNIX_TIMESTAMP() - 1 WHERE session_id = ?', [sessionId]);
    const res = await c.get('/api/stations');
    expect(res.status).toBe(401);
    expect(res.body.error).toBe('not_signed_in');
  });

  it('restarts the idle clock with every request', async () => {
    const { c, sessionId } = await signedInSession(DEMO.supervisor);
    await t.db.query('UPDATE sessions SET expires = UNIX_TIMESTAMP() + 60 WHERE session_id = ?', [sessionId]);
    await c.get('/api/stations').expect(200);
    const expiry = await storedExpiryMs(sessionId);
    expect((expiry ?? 0) - Date.now()).toBeGreaterThan(IDLE_LIMIT - 5_000);
  });
});

// OWASP ASVS 5.0 V7.3.2 (absolute maximum session lifetime), number from memory.
describe('absolute timeout', () => {
  async function signedInAgo(ms: number) {
    const s = await signedInSession(DEMO.finance);
    await t.db.query(`UPDATE sessions SET data = JSON_SET(data, '$.signedInAt', ?) WHERE session_id = ?`, [Date.now() - ms, s.sessionId]);
    return s;
  }

  it('keeps a busy session that is still inside the absolute limit', async () => {
    const { c } = await signedInAgo(ABSOLUTE_LIMIT - 10 * MINUTE);
    await c.get('/api/stations').expect(200);
  });

  it('ends a session older than the absolute limit even though it was active a moment ago', async () => {
    const { c, sessionId } = await signedInAgo(ABSOLUTE_LIMIT + MINUTE);
    const res = await c.get('/api/stations');
    expect(res.status).toBe(401);
    expect(res.body.error).toBe('not_signed_in');
    expect(await storedExpiryMs(sessionId)).toBeUndefined();
    const session = await c.get('/api/auth/session').expect(200);
    expect(session.body.user).toBeNull();
  });

  it('answers a state-changing call on an expired session with a clean refusal, not a server error', async () => {
    const { c } = await signedInAgo(ABSOLUTE_LIMIT + MINUTE);
    const res = await c.post('/api/auth/sign-out');
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('csrf_token_invalid');
  });
});

// OWASP ASVS 5.0 V3.4 (browser security headers), number from memory.
describe('hardening headers (helmet)', () => {
  it.each([
    ['a public answer', '/api/auth/session', 200],
    ['a refusal', '/api/stations', 401],
    ['an unknown API route', '/api/no-such-route', 404],
  ])('are present on %s', async (_name, path, status) => {
    const res = await request(t.app).get(path);
    expect(res.status).toBe(status);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['content-security-policy']).toContain("frame-ancestors 'self'");
    expect(res.headers['content-security-policy']).toContain("object-src 'none'");
    expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['cross-origin-opener-policy']).toBe('same-origin');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
