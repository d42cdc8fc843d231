// Sign-in throttling as an attacker meets it, against the real app: failures count per account AND address, waits
// grow but never lock an account, an address is slowed rather than shut, a password reset clears the account, and
// the client address comes only from proxies the configuration trusts.
// Yardsticks: rate-limiter-flexible's login-protection example (consecutive fails by username+IP, slow brute force by
// IP); OWASP ASVS 5.0 V6.3.1 (brute force and credential stuffing controls) and V4.1.3 (a header set by an
// intermediary is trusted only from a trusted one); requirement numbers from memory.
// Client addresses are from the documentation ranges of RFC 5737, never real hosts.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import mysql from 'mysql2';
import { createSignInThrottle, THROTTLE_TABLE } from '../../server/src/modules/auth/throttle';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, TEST_PASSWORD, insertUser, removeRunUsers, signInFrom, stationIdByIata } from './helpers';

// Every wrong password costs a full scrypt hash, slow on a shared machine.
vi.setConfig({ testTimeout: 90_000 });

const pool = mysql.createPool({ uri: String(process.env.DATABASE_URL).replace(/^mariadb:/, 'mysql:'), connectionLimit: 2 });
const dbName = decodeURIComponent(new URL(String(process.env.DATABASE_URL)).pathname.slice(1));

let t: TestApp;
let bosId: number;
beforeAll(async () => {
  // The production arrangement: counts in MariaDB. Small allowances so the tests reach them quickly.
  t = await startTestApp({ throttle: createSignInThrottle({ perAccount: 3, perAddress: 8, baseDelaySeconds: 4, maxAddressDelaySeconds: 4, mysql: { pool, dbName } }) });
  bosId = await stationIdByIata(t.db, 'BOS');
  // Address counts outlive a run in the database; earlier runs' counts for the documentation addresses would bleed in.
  await pool.promise().query(`DELETE FROM ?? WHERE \`key\` LIKE 'signin_addr_%'`, [THROTTLE_TABLE]);
});
afterAll(async () => {
  await removeRunUsers(t.db);
  await t.close();
  await new Promise((r) => pool.end(r));
});

const attempt = (app: TestApp, email: string, password: string, address: string) => signInFrom(new Client(app.app), email, password, address);
const newAgent = (label: string) => insertUser(t.db, { label, role: 'agent', stationIds: [bosId] });

describe('per account and address', () => {
  it('does not let failures from other addresses lock an agent out at their own desk', async () => {
    const agent = await newAgent('targeted');
    // An attacker at two other addresses, each past its free allowance (every wrong password costs a full hash).
    for (let i = 0; i < 2; i++) for (let k = 0; k < 4; k++) expect((await attempt(t, agent.email, `guess-${i}-${k}`, `203.0.113.${i + 1}`)).status).toBe(401);
    expect((await attempt(t, agent.email, TEST_PASSWORD, '198.51.100.10')).status).toBe(200);
  });

  it('makes a guessing pair wait, saying how long in words and in Retry-After, even for the right password', async () => {
    const agent = await newAgent('waiting');
    for (let i = 0; i < 4; i++) await attempt(t, agent.email, `guess-${i}`, '203.0.113.50');
    const res = await attempt(t, agent.email, TEST_PASSWORD, '203.0.113.50');
    expect(res.status).toBe(429);
    expect(res.body.error).toBe('too_many_attempts');
    expect(Number(res.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(res.body.message).toMatch(/wait \d+ (second|minute)/i);
    expect(res.body.user).toBeUndefined();
  });

  it('never locks for good: the right password works from that address once the wait is over', async () => {
    const agent = await newAgent('patient');
    for (let i = 0; i < 4; i++) await attempt(t, agent.email, `guess-${i}`, '203.0.113.60');
    expect((await attempt(t, agent.email, TEST_PASSWORD, '203.0.113.60')).status).toBe(429);
    // The first wait is four seconds (baseDelaySeconds above).
    await expect.poll(async () => (await attempt(t, agent.email, TEST_PASSWORD, '203.0.113.60')).status, { timeout: 30_000, interval: 1_000 }).toBe(200);
  });

  it('clears the account at every address when an admin sets a new password', async () => {
    const agent = await newAgent('reset');
    // The address checked comes last and fails once more, so its wait (8 s) outlasts the slow hashing of this test.
    for (const [ip, failures] of [['198.51.100.21', 4], ['198.51.100.20', 5]] as const) for (let i = 0; i < failures; i++) await attempt(t, agent.email, `guess-${i}`, ip);
    expect((await attempt(t, agent.email, TEST_PASSWORD, '198.51.100.20')).status).toBe(429);
    const [[{ n: before }]] = (await pool.promise().query(`SELECT COUNT(*) AS n FROM ?? WHERE \`key\` LIKE ?`, [THROTTLE_TABLE, `%${agent.email}|%`])) as unknown as [[{ n: number }]];
    expect(Number(before)).toBeGreaterThan(0);

    const admin = await signedIn(t, DEMO.admin);
    await admin.patch(`/api/users/${agent.id}`, { password: 'a-reset-password-from-the-admin' }).expect(200);
    for (const ip of ['198.51.100.20', '198.51.100.21']) expect((await attempt(t, agent.email, 'a-reset-password-from-the-admin', ip)).status).toBe(200);
  });

  it('keeps its counts in the database, so a new server process does not forget them', async () => {
    const agent = await newAgent('restart');
    for (let i = 0; i < 5; i++) await attempt(t, agent.email, `guess-${i}`, '198.51.100.30');
    const again = createSignInThrottle({ perAccount: 3, mysql: { pool, dbName } });
    await expect(again.check(agent.email, '198.51.100.30')).rejects.toMatchObject({ kind: 'rate_limited', code: 'too_many_attempts' });
  });
});

describe('per address', () => {
  it('slows an address that sprays guesses, rather than shutting out everyone behind it', async () => {
    const shared = '198.51.100.40';
    for (let i = 0; i < 10; i++) await attempt(t, `nobody-${i}-${Date.now()}@bumpboard.test`, 'guessed-password', shared);
    const slowed = await attempt(t, DEMO.supervisor, 'bumpboard-demo-2026', shared);
    expect(slowed.status).toBe(429);
    expect(Number(slowed.headers['retry-after'])).toBeLessThanOrEqual(4);
    await expect.poll(async () => (await attempt(t, DEMO.supervisor, 'bumpboard-demo-2026', shared)).status, { timeout: 30_000, interval: 1_000 }).toBe(200);
  });

  it('does not count malformed requests, which cannot test a password', async () => {
    const address = '198.51.100.41';
    for (let i = 0; i < 12; i++) expect((await attempt(t, 'not-an-e-mail', 'x', address)).status).toBe(400);
    expect((await attempt(t, DEMO.finance, 'bumpboard-demo-2026', address)).status).toBe(200);
  });
});

describe('client address from configuration', () => {
  it('ignores X-Forwarded-For when no proxy is configured, so rotating it does not escape the address count', async () => {
    const direct = await startTestApp({ env: { TRUST_PROXY: '' }, throttle: createSignInThrottle({ perAccount: 1000, perAddress: 3, baseDelaySeconds: 60 }) });
    try {
      for (let i = 0; i < 4; i++) expect((await attempt(direct, `sprayed-${i}-${Date.now()}@bumpboard.test`, 'guessed-password', `203.0.113.${100 + i}`)).status).toBe(401);
      expect((await attempt(direct, DEMO.agent, 'bumpboard-demo-2026', '203.0.113.200')).status).toBe(429);
    } finally {
      await direct.close();
    }
  });
});
