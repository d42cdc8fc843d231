import { Router, type Request, type Response } from 'express';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { signInBodySchema, type SessionResponse } from '@shared/schemas/auth';
import { parse } from '../../http/validate';
import type { Csrf } from '../../http/csrf';
import type { SignInThrottle } from './throttle';
import { authenticate, refuseSignIn } from './auth.service';
import { loadActiveSessionUser } from './session-user';

export function configurePassport(db: DataSource) {
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      authenticate(db, email, password).then((u) => done(null, u ?? false), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((id: number, done) => {
    loadActiveSessionUser(db, id).then((u) => done(null, u ?? false), done);
  });
}

export interface AuthRouterDeps {
  db: DataSource;
  throttle: SignInThrottle;
  csrf: Csrf;
  cookieName: string;
  demo: boolean;
  onSignOut?: (userId: number) => void;
}

export function authRouter(deps: AuthRouterDeps) {
  const r = Router();

  const sessionResponse = (req: Request, res: Response, overwrite = false): SessionResponse => ({
    user: req.user ?? null,
    csrfToken: deps.csrf.issueToken(req, res, overwrite),
    demo: deps.demo,
  });

  // Public: tells the client who is signed in and hands out the CSRF token (stores no session before sign-in).
  r.get('/session', (req, res) => {
    res.json(sessionResponse(req, res));
  });

  // Public, CSRF-protected like every POST; throttled per account-and-address and per address.
  r.post('/sign-in', async (req, res, next) => {
    const body = parse(signInBodySchema, req.body);
    // req.ip honours only the proxies the configuration trusts, so a forged X-Forwarded-For cannot pick the address.
    const ip = req.ip ?? 'unknown';
    await deps.throttle.check(body.email, ip);
    req.body = body;
    passport.authenticate('local', (err: unknown, user: Express.User | false) => {
      if (err) return next(err);
      if (!user) {
        refuseSignIn(deps.throttle, body.email, ip).catch(next);
        return;
      }
      // req.logIn regenerates the session, so a session id planted before sign-in is worthless afterwards.
      req.logIn(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        req.session.signedInAt = Date.now();
        deps.csrf.forgetAnonymous(res);
        deps.throttle.recordSuccess(body.email, ip).then(() => res.json(sessionResponse(req, res, true)), next);
      });
    })(req, res, next);
  });

  r.post('/sign-out', (req, res, next) => {
    const userId = req.user?.id;
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy((destroyErr) => {
        if (destroyErr) return next(destroyErr);
        if (userId) deps.onSignOut?.(userId);
        // A browser drops a `__Host-` cookie only when told so with the same Secure, path-wide attributes.
        res.clearCookie(deps.cookieName, { path: '/', httpOnly: true, sameSite: 'lax', secure: deps.cookieName.startsWith('__Host-') });
        res.status(204).end();
      });
    });
  });

  return r;
}
