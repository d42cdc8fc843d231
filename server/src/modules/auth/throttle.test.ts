// The sign-in throttle's arithmetic, on its memory store: free failures, then waits that double up to a cap, kept
// per account-and-address pair; an address slowed on its own scale; success and a password reset clear the account.
// Yardsticks: rate-limiter-flexible's login-protection example (consecutive failures by username and IP; slow brute
// force by IP) and OWASP ASVS 5.0 V6.3.1 (brute-force and credential-stuffing controls), requirement number from memory.
import { describe, expect, it } from 'vitest';
import { RetryLaterError } from '../../domain/errors';
import { createSignInThrottle } from './throttle';

async function waitFor(check: Promise<void>): Promise<number> {
  try {
    await check;
    return 0;
  } catch (err) {
    if (err instanceof RetryLaterError) return err.retryAfterSeconds;
    throw err;
  }
}

const A = 'agent@bumpboard.test';

describe('account at an address', () => {
  it('lets the free failures pass, then doubles the wait with each further failure, up to the cap', async () => {
    const t = createSignInThrottle({ perAccount: 3, perAddress: 1000, baseDelaySeconds: 2, maxAccountDelaySeconds: 16 });
    const waits: number[] = [];
    for (let i = 0; i < 8; i++) {
      await t.recordFailure(A, '192.0.2.1');
      waits.push(await waitFor(t.check(A, '192.0.2.1')));
    }
    // Failures 1–3 free; then 2, 4, 8, 16 s, then held at the 16 s cap (a wait, never a lock).
    expect(waits).toEqual([0, 0, 0, 2, 4, 8, 16, 16]);
  });

  it('keeps the wait to the pair: the same account from another address, and another account here, pass', async () => {
    const t = createSignInThrottle({ perAccount: 1, perAddress: 1000 });
    await t.recordFailure(A, '192.0.2.1');
    await t.recordFailure(A, '192.0.2.1');
    expect(await waitFor(t.check(A, '192.0.2.1'))).toBeGreaterThan(0);
    expect(await waitFor(t.check(A, '192.0.2.2'))).toBe(0);
    expect(await waitFor(t.check('supervisor@bumpboard.test', '192.0.2.1'))).toBe(0);
  });

  it('counts the account whatever the letter case of the e-mail', async () => {
    const t = createSignInThrottle({ perAccount: 1, perAddress: 1000 });
    await t.recordFailure(A, '192.0.2.1');
    await t.recordFailure(A.toUpperCase(), '192.0.2.1');
    expect(await waitFor(t.check(A, '192.0.2.1'))).toBeGreaterThan(0);
  });

  it('starts again after a success at that address', async () => {
    const t = createSignInThrottle({ perAccount: 2, perAddress: 1000 });
    for (let i = 0; i < 3; i++) await t.recordFailure(A, '192.0.2.1');
    await t.recordSuccess(A, '192.0.2.1');
    await t.recordFailure(A, '192.0.2.1');
    expect(await waitFor(t.check(A, '192.0.2.1'))).toBe(0);
  });

  it('forgets the account at every address when its password is reset', async () => {
    const t = createSignInThrottle({ perAccount: 1, perAddress: 1000 });
    for (const ip of ['192.0.2.1', '192.0.2.2']) for (let i = 0; i < 3; i++) await t.recordFailure(A, ip);
    await t.clearAccount(A.toUpperCase());
    expect(await waitFor(t.check(A, '192.0.2.1'))).toBe(0);
    expect(await waitFor(t.check(A, '192.0.2.2'))).toBe(0);
  });
});

describe('address', () => {
  it('slows an address past its allowance, with a short cap, whichever accounts it tries', async () => {
    const t = createSignInThrottle({ perAccount: 1000, perAddress: 4, baseDelaySeconds: 1, maxAddressDelaySeconds: 8 });
    const waits: number[] = [];
    for (let i = 0; i < 9; i++) {
      await t.recordFailure(`guess-${i}@bumpboard.test`, '198.51.100.7');
      waits.push(await waitFor(t.check(A, '198.51.100.7')));
    }
    expect(waits).toEqual([0, 0, 0, 0, 1, 2, 4, 8, 8]);
    expect(await waitFor(t.check(A, '198.51.100.8'))).toBe(0);
  });
});
