// Sign-in throttling after rate-limiter-flexible's own login-protection pattern: consecutive failures are counted per
// account AND address together (so failures from elsewhere never lock a real agent out at their own desk), and
// failures per address are counted to slow a guessing address down. Past a free allowance each failure adds a wait
// that doubles, capped; nothing locks an account for good, and a password reset clears the account's counts.
import type { RateLimiterAbstract } from 'rate-limiter-flexible';
import { retryLater } from '../../domain/errors';
import { COUNTER_TABLE, sharedCounter, type CounterStore } from '../../db/shared-counter';

export interface SignInThrottle {
  /** Refuses (rate limited, with the wait in seconds) while this account-and-address pair, or this address, must wait. */
  check(email: string, ip: string): Promise<void>;
  recordFailure(email: string, ip: string): Promise<void>;
  recordSuccess(email: string, ip: string): Promise<void>;
  /** Forgets every count of the account, from every address: an admin's password reset lets the user straight in. */
  clearAccount(email: string): Promise<void>;
}

export interface SignInThrottleOptions {
  /** Failures of one account from one address before waits begin (the pattern's example allows 10; we allow 5). */
  perAccount?: number;
  /** Failures from one address per day before that address is slowed (the pattern's example: 100). */
  perAddress?: number;
  /** First wait; each further failure doubles it. */
  baseDelaySeconds?: number;
  /** Longest wait for an account at an address: a wait, never a lock. */
  maxAccountDelaySeconds?: number;
  /** Longest wait for an address: short, because a whole airport may share it. */
  maxAddressDelaySeconds?: number;
  /** MariaDB store (the server's own pool and database); without it counts live in this process's memory. */
  mysql?: CounterStore;
}

export const THROTTLE_TABLE = COUNTER_TABLE;
const PREFIX = { accountFails: 'signin_acct_fails', accountWait: 'signin_acct_wait', addressFails: 'signin_addr_fails', addressWait: 'signin_addr_wait' };
const DAY = 24 * 3600;

export function createSignInThrottle(opts: SignInThrottleOptions = {}): SignInThrottle {
  const freePerAccount = opts.perAccount ?? 5;
  const freePerAddress = opts.perAddress ?? 100;
  const base = opts.baseDelaySeconds ?? 2;
  const maxAccount = opts.maxAccountDelaySeconds ?? 15 * 60;
  const maxAddress = opts.maxAddressDelaySeconds ?? 60;

  const limiter = (keyPrefix: string, duration: number): RateLimiterAbstract => sharedCounter(opts.mysql, { keyPrefix, points: 1_000_000, duration });
  // Counts: consecutive failures of a pair are kept until a success or a reset clears them, or 14 days pass (the
  // pattern keeps 90; the memory store's timers cannot reach past 24.8 days, and two weeks is plenty to slow a guesser).
  const accountFails = limiter(PREFIX.accountFails, 14 * DAY);
  const addressFails = limiter(PREFIX.addressFails, DAY);
  // Waits: a key is "blocked" for the wait's length; its points are irrelevant.
  const accountWait = limiter(PREFIX.accountWait, DAY);
  const addressWait = limiter(PREFIX.addressWait, DAY);
  // The memory store cannot list keys, so it remembers which addresses each account failed from.
  const addressesOf = new Map<string, Set<string>>();

  const pair = (email: string, ip: string) => `${email.toLowerCase()}|${ip}`;
  const delay = (failures: number, free: number, max: number) => (failures <= free ? 0 : Math.min(max, base * 2 ** (failures - free - 1)));
  const waiting = async (l: RateLimiterAbstract, key: string) => {
    const res = await l.get(key);
    return res && res.consumedPoints > 1_000_000 && res.msBeforeNext > 0 ? res.msBeforeNext : 0;
  };

  return {
    async check(email, ip) {
      const [pairMs, addressMs] = await Promise.all([waiting(accountWait, pair(email, ip)), waiting(addressWait, ip)]);
      const ms = Math.max(pairMs, addressMs);
      if (ms > 0) throw retryLater(Math.ceil(ms / 1000));
    },
    async recordFailure(email, ip) {
      const key = pair(email, ip);
      if (!opts.mysql) addressesOf.set(email.toLowerCase(), (addressesOf.get(email.toLowerCase()) ?? new Set()).add(ip));
      const [a, b] = await Promise.all([accountFails.penalty(key, 1), addressFails.penalty(ip, 1)]);
      const pairDelay = delay(a.consumedPoints, freePerAccount, maxAccount);
      const addressDelay = delay(b.consumedPoints, freePerAddress, maxAddress);
      await Promise.all([pairDelay && accountWait.block(key, pairDelay), addressDelay && addressWait.block(ip, addressDelay)]);
    },
    async recordSuccess(email, ip) {
      const key = pair(email, ip);
      await Promise.all([accountFails.delete(key), accountWait.delete(key)]);
    },
    async clearAccount(email) {
      const account = email.toLowerCase();
      if (opts.mysql) {
        const like = `${account.replace(/[\\%_]/g, (c) => `\\${c}`)}|%`;
        await opts.mysql.pool
          .promise()
          .query(`DELETE FROM ?? WHERE \`key\` LIKE ? OR \`key\` LIKE ?`, [THROTTLE_TABLE, `${PREFIX.accountFails}:${like}`, `${PREFIX.accountWait}:${like}`]);
        return;
      }
      const ips = addressesOf.get(account) ?? new Set<string>();
      addressesOf.delete(account);
      await Promise.all([...ips].flatMap((ip) => [accountFails.delete(pair(account, ip)), accountWait.delete(pair(account, ip))]));
    },
  };
}
