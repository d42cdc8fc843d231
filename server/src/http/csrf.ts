// CSRF protection on every state-changing API call, in two forms:
// - signed in: a synchronizer token kept in the session (csrf-sync), as before;
// - not yet signed in (the sign-in form): a signed double-submit token, so that merely opening the sign-in page stores
//   no session row. The browser holds a random value in an HttpOnly cookie; the token handed to the page is an HMAC
//   of that value under the server's secret. A cross-site page can neither read the token nor forge one, and in
//   production the `__Host-` prefix stops a sibling host from planting its own cookie.
import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { csrfSync } from 'csrf-sync';
import type { Env } from '../config/env';
import { forbidden } from './errors';

export const CSRF_HEADER = 'x-csrf-token';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const ANONYMOUS_PREFIX = 'anon.';

export interface Csrf {
  /** The token for the page: the session's own once signed in, the double-submit one before. */
  issueToken(req: Request, res: Response, overwrite?: boolean): string;
  protection: RequestHandler;
  /** Called at sign-in: the anonymous cookie has done its job. */
  forgetAnonymous(res: Response): void;
}

export const csrfRefused = () => forbidden('The form was stale or not from this app. Reload the page and try again.', 'csrf_token_invalid');

function readCookie(req: Request, name: string): string | undefined {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return decodeURIComponent(part.slice(eq + 1).trim());
  }
  return undefined;
}

export function createCsrf(env: Pick<Env, 'NODE_ENV' | 'SESSION_SECRET'>): Csrf {
  const production = env.NODE_ENV === 'production';
  const cookieName = production ? '__Host-bumpboard.pre' : 'bumpboard.pre';
  const key = createHmac('sha256', env.SESSION_SECRET).update('bumpboard anonymous csrf').digest();
  const sign = (nonce: string) => ANONYMOUS_PREFIX + createHmac('sha256', key).update(nonce).digest('base64url');
  const sync = csrfSync({ getTokenFromRequest: (req) => req.headers[CSRF_HEADER] as string | undefined });

  const signedIn = (req: Request) => Boolean(req.user);

  return {
    issueToken(req, res, overwrite = false) {
      if (signedIn(req)) return sync.generateToken(req, overwrite);
      let nonce = readCookie(req, cookieName);
      if (!nonce || !/^[A-Za-z0-9_-]{43}$/.test(nonce) || overwrite) {
        nonce = randomBytes(32).toString('base64url');
        res.cookie(cookieName, nonce, { httpOnly: true, sameSite: 'strict', secure: production, path: '/' });
      }
      return sign(nonce);
    },
    protection(req, res, next) {
      if (SAFE_METHODS.has(req.method)) return next();
      if (signedIn(req)) return sync.csrfSynchronisedProtection(req, res, next);
      const given = Buffer.from(String(req.headers[CSRF_HEADER] ?? ''));
      const nonce = readCookie(req, cookieName);
      const expected = Buffer.from(nonce ? sign(nonce) : '');
      if (!nonce || given.length !== expected.length || !timingSafeEqual(given, expected)) throw csrfRefused();
      next();
    },
    forgetAnonymous(res) {
      res.clearCookie(cookieName, { httpOnly: true, sameSite: 'strict', secure: production, path: '/' });
    },
  };
}
