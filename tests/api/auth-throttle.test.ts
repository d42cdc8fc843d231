// Sign-in throttling per account and per client address, with tight limits so the tests reach them quickly.
// Outside source, from memory: OWASP Authentication Cheat Sheet ("Protect against automated attacks": limit failed
// attempts per account and per source; tell the user to wait rather than reveal whether the password was right).
// Client addresses are from the documentation ranges TEST-NET-2 and TEST-NET-3 (RFC 5737), never real hosts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSignInThrottle } from '../../server/src/modules/auth/throttle';
import { Client, DEMO_PASSWORD, startTestApp, type TestApp } from './harness';
import { DEMO, TEST_PASSWORD, insertUser, removeRunUsers, signInFrom, stationIdByIata, uniqueEmail } from './helpers';

const PER_ACCOUNT = 3;
const PER_ADDRESS = 5;
// Long enough that the window cannot lapse during the run.
const WINDOW_SECONDS = 15 * 60;

let t: TestApp;
let bosId: number;
beforeAll(async () => {
  t = await startTestApp({ throttle: createSignInThrottle({ perAccount: PER_ACCOUNT, perAddress: PER_ADDRESS, windowSeconds: WINDOW_SECONDS }) });
  bosId = await stationIdByIata(t.db, 'BOS');
});
afterAll(async () => {
  await removeRunUsers(t.db);
  await t.close();
});

const attempt = (email: string, password: string, address: string) => signInFrom(new Client(t.app), email, password, address);

function expectThrottled(res: Awaited<ReturnType<typeof attempt>>) {
  expect(res.status).toBe(429);
  expect(res.body.error).toBe('too_many_attempts');
  // The window is 15 minutes, so the wait named is between 1 and 15 minutes.
  const minutes = Number(/wait (\d+) minutes?/i.exec(res.body.message)?.[1]);
  expect(minutes).toBeGreaterThanOrEqual(1);
  expect(minutes).toBeLessThanOrEqual(WINDOW_SECONDS / 60);
  expect(res.body.user).toBeUndefined();
}

describe('per account', () => {
  it('refuses even the right password with 429 after the failure limit, from any address', async () => {
    const user = await insertUser(t.db, { label: 'locked', role: 'agent', stationIds: [bosId] });
    for (let i = 0; i < PER_ACCOUNT; i++) {
      expect((await attempt(user.email, `wrong-password-${i}`, '203.0.113.10')).status).toBe(401);
    }
    expectThrottled(await attempt(user.email, TEST_PASSWORD, '203.0.113.10'));
    expectThrottled(await attempt(user.email, TEST_PASSWORD, '203.0.113.11'));
    // The limit is on that account: another account from the same address still signs in.
    expect((await attempt(DEMO.agent, DEMO_PASSWORD, '203.0.113.10')).status).toBe(200);
  });

  it('counts the account whatever the letter case of the e-mail', async () => {
    const user = await insertUser(t.db, { label: 'casing', role: 'agent', stationIds: [bosId] });
    for (let i = 0; i < PER_ACCOUNT; i++) {
      const spelled = i % 2 ? user.email.toUpperCase() : user.email;
      expect((await attempt(spelled, `wrong-password-${i}`, `203.0.113.${20 + i}`)).status).toBe(401);
    }
    expectThrottled(await attempt(user.email, TEST_PASSWORD, '203.0.113.29'));
  });

  it('starts the count again after a successful sign-in', async () => {
    const user = await insertUser(t.db, { label: 'reset', role: 'agent', stationIds: [bosId] });
    for (let round = 0; round < 2; round++) {
      for (let i = 0; i < PER_ACCOUNT - 1; i++) {
        expect((await attempt(user.email, `wrong-password-${i}`, `203.0.113.${40 + round}`)).status).toBe(401);
      }
      expect((await attempt(user.email, TEST_PASSWORD, `203.0.113.${40 + round}`)).status).toBe(200);
    }
  });
});

describe('per address', () => {
  it('refuses every sign-in from an address after its failure limit, while other addresses sign in', async () => {
    const noisy = '198.51.100.20';
    for (let i = 0; i < PER_ADDRESS; i++) {
      // A different unknown account each time, so no single account reaches its own limit.
      expect((await attempt(uniqueEmail('sprayed'), 'guessed-password', noisy)).status).toBe(401);
    }
    expectThrottled(await attempt(DEMO.supervisor, DEMO_PASSWORD, noisy));
    expect((await attempt(DEMO.supervisor, DEMO_PASSWORD, '198.51.100.21')).status).toBe(200);
  });

  it('does not count malformed requests, which cannot test a password', async () => {
    const address = '198.51.100.30';
    for (let i = 0; i < PER_ADDRESS + 1; i++) {
      expect((await attempt('not-an-e-mail', 'x', address)).status).toBe(400);
    }
    expect((await attempt(DEMO.finance, DEMO_PASSWORD, address)).status).toBe(200);
  });
});
