// Sign-in throttling per account and per address, so guessing is slow without letting one address lock everyone out.
import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible';
import { tooManyRequests } from '../../http/errors';

export interface SignInThrottle {
  check(email: string, ip: string): Promise<void>;
  recordFailure(email: string, ip: string): Promise<void>;
  recordSuccess(email: string): Promise<void>;
}

export function createSignInThrottle(opts: { perAccount?: number; perAddress?: number; windowSeconds?: number } = {}): SignInThrottle {
  const windowSeconds = opts.windowSeconds ?? 15 * 60;
  // Common practice (OWASP Authentication Cheat Sheet, from memory): a handful of failures per account per window.
  const byAccount = new RateLimiterMemory({ keyPrefix: 'acct', points: opts.perAccount ?? 5, duration: windowSeconds });
  const byAddress = new RateLimiterMemory({ keyPrefix: 'addr', points: opts.perAddress ?? 50, duration: windowSeconds });

  const refuse = (res: RateLimiterRes) => {
    const minutes = Math.max(1, Math.ceil(res.msBeforeNext / 60_000));
    return tooManyRequests(`Too many failed sign-ins. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again, or ask an admin to reset your password.`);
  };

  return {
    async check(email, ip) {
      const [a, b] = await Promise.all([byAccount.get(email.toLowerCase()), byAddress.get(ip)]);
      if (a && a.remainingPoints <= 0) throw refuse(a);
      if (b && b.remainingPoints <= 0) throw refuse(b);
    },
    async recordFailure(email, ip) {
      await Promise.all([byAccount.penalty(email.toLowerCase(), 1), byAddress.penalty(ip, 1)]);
    },
    async recordSuccess(email) {
      await byAccount.delete(email.toLowerCase());
    },
  };
}
