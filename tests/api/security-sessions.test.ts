// Sessions as stored: nothing before sign-in (and nothing for health checks), `__Host-` Secure cookies in production,
// the idle deadline written at most once a minute, and the signed-in user read once per request.
// Yardsticks (OWASP ASVS 5.0, requirement numbers from memory): V7.2.4 (a new session at sign-in), V3.3.1 (cookies
// Secure and `__Host-` prefixed), V7.3.1 (inactivity timeout enforced on the server); OWASP Session Management
// Cheat Sheet (no session for unauthenticated users where none is needed); OWASP CSRF Prevention Cheat Sheet
// (signed double-submit cookie for pre-session requests). The write and read counts are our own performance goals.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Client, DEMO_PASSWORD, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, sessionIdFrom } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const setCookies = (res: request.Response) => (res.headers['set-cookie'] as unknown as string[] | undefined) ?? [];
const sessionRowsHolding = async (csrfToken: string) => {
  const [{ n }] = await t.db.query(`SELECT COUNT(*) AS n FROM sessions WHERE JSON_VALUE(data, '$.csrfToken') = ?`, [csrfToken]);
  return Number(n);
};

describe('before sign-in', () => {
  it('stores no session for the sign-in page, a failed sign-in, a health check or an unknown route', async () => {
    const c = new Client(t.app);
    const page = await c.agent.get('/api/auth/session').expect(200);
    expect(page.body.user).toBeNull();
    expect(setCookies(page).some((h) => h.startsWith('bumpboard.sid='))).toBe(false);
    expect(await sessionRowsHolding(page.body.csrfToken)).toBe(0);

    const failed = await c.agent.post('/api/auth/sign-in').set('X-CSRF-Token', page.body.csrfToken).send({ email: DEMO.agent, password: 'not-the-password' });
    expect(failed.status).toBe(401);
    for (const res of [failed, await request(t.app).get('/api/health'), await request(t.app).get('/api/no-such-route')]) {
      expect(setCookies(res).some((h) => h.startsWith('bumpboard.sid='))).toBe(false);
    }
  });

  it('accepts the sign-in form’s token only with the cookie it was made for', async () => {
    const browser = new Client(t.app);
    const page = await browser.agent.get('/api/auth/session').expect(200);
    // The same token from a client without that cookie (a forged cross-site post) is refused.
    const forged = await request(t.app).post('/api/auth/sign-in').set('X-CSRF-Token', page.body.csrfToken).send({ email: DEMO.agent, password: DEMO_PASSWORD });
    expect([forged.status, forged.body.error]).toEqual([403, 'csrf_token_invalid']);
    const own = await browser.agent.post('/api/auth/sign-in').set('X-CSRF-Token', page.body.csrfToken).send({ email: DEMO.agent, password: DEMO_PASSWORD });
    expect(own.status).toBe(200);
  });
});

describe('writing the idle deadline', () => {
  async function storedExpiry(sessionId: string): Promise<number> {
    const [row] = await t.db.query('SELECT expires FROM sessions WHERE session_id = ?', [sessionId]);
    return Number(row.expires);
  }

  it('leaves the row alone when the deadline would move by less than a minute, and moves it when more', async () => {
    const c = await signedIn(t, DEMO.supervisor);
    const sessionId = sessionIdFrom(await c.get('/api/stations').expect(200));
    // As if the last write were 30 seconds ago: a request now moves the deadline by about 30 s, so nothing is written.
    await t.db.query('UPDATE sessions SET expires = expires - 30 WHERE session_id = ?', [sessionId]);
    const before = await storedExpiry(sessionId);
    await c.get('/api/stations').expect(200);
    await c.get('/api/auth/session').expect(200);
    expect(await storedExpiry(sessionId)).toBe(before);
    // Two minutes ago: this request writes the new deadline (30 minutes from now, the configured idle limit).
    await t.db.query('UPDATE sessions SET expires = UNIX_TIMESTAMP() + 30 * 60 - 120 WHERE session_id = ?', [sessionId]);
    await c.get('/api/stations').expect(200);
    expect(Math.abs((await storedExpiry(sessionId)) - (Date.now() / 1000 + 30 * 60))).toBeLessThan(5);
  });
});

describe('reading the signed-in user', () => {
  it('reads the user once per request', async () => {
    const c = await signedIn(t, DEMO.agent);
    const queries: string[] = [];
    const logger = t.db.logger;
    const original = logger.logQuery.bind(logger);
    logger.logQuery = (query, parameters, runner) => {
      queries.push(query);
      return original(query, parameters, runner);
    };
    try {
      await c.get('/api/stations').expect(200);
    } finally {
      logger.logQuery = original;
    }
    expect(queries.filter((q) => /FROM `users`/i.test(q))).toHaveLength(1);
  });
});

describe('in production', () => {
  const productionEnv = {
    NODE_ENV: 'production',
    SESSION_SECRET: randomBytes(32).toString('base64url'),
    STRIPE_SECRET_KEY: `sk_test_${randomBytes(12).toString('hex')}`,
    STRIPE_WEBHOOK_SECRET: `whsec_${randomBytes(16).toString('hex')}`,
  };

  it('names the cookies __Host- and marks them Secure, HttpOnly, Path=/ and without Domain', async () => {
    const prod = await startTestApp({ env: productionEnv });
    try {
      // Behind a TLS-terminating proxy on loopback (TRUST_PROXY=loopback in the test harness).
      const agent = request.agent(prod.app);
      const page = await agent.get('/api/auth/session').set('X-Forwarded-Proto', 'https').expect(200);
      const pre = setCookies(page).find((h) => h.startsWith('__Host-bumpboard.pre='));
      const res = await agent.post('/api/auth/sign-in').set('X-Forwarded-Proto', 'https').set('Cookie', (pre ?? '').split(';')[0]).set('X-CSRF-Token', page.body.csrfToken).send({ email: DEMO.agent, password: DEMO_PASSWORD });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      const sid = setCookies(res).find((h) => h.startsWith('__Host-bumpboard.sid='));
      for (const cookie of [pre, sid]) {
        expect(cookie).toBeDefined();
        expect(cookie).toMatch(/;\s*Secure/i);
        expect(cookie).toMatch(/;\s*HttpOnly/i);
        expect(cookie).toMatch(/;\s*Path=\/(;|$)/i);
        expect(cookie).not.toMatch(/;\s*Domain=/i);
      }
      expect(setCookies(res).some((h) => h.startsWith('bumpboard.sid='))).toBe(false);
    } finally {
      await prod.close();
    }
  });
});
