// Sessions live in MariaDB so a restart signs nobody out, with idle and absolute time limits. A session row exists only
// once someone signs in (saveUninitialized: false, and the anonymous CSRF token needs no session: see csrf.ts).
import session from 'express-session';
import MySQLStoreFactory from 'express-mysql-session';
import type { RequestHandler } from 'express';
import mysql from 'mysql2/promise';
import type { Env } from '../config/env';

declare module 'express-session' {
  interface SessionData {
    signedInAt?: number;
    passport?: { user?: number };
  }
}

export interface SessionSetup {
  middleware: RequestHandler;
  enforceAbsoluteTimeout: RequestHandler;
  pool: mysql.Pool;
  /** The database the pool points at (the sign-in throttle keeps its counts there too). */
  dbName: string;
  cookieName: string;
  close(): Promise<void>;
}

/** `__Host-` in production: the browser then insists on Secure, path / and no Domain, so no sibling host can plant it. */
export const sessionCookieName = (env: Pick<Env, 'NODE_ENV'>) => (env.NODE_ENV === 'production' ? '__Host-bumpboard.sid' : 'bumpboard.sid');

/** The idle deadline moves with activity, but writing it on every request costs a row update each time; once a minute keeps the limit within a minute. */
const TOUCH_EVERY_SECONDS = 60;

type Callback = (err?: unknown, value?: unknown) => void;
interface StoreInternals {
  query(sql: string, params: unknown[]): Promise<[Array<{ data: unknown; expires: number }>, unknown]>;
  touch(sid: string, sess: session.SessionData, cb?: Callback): Promise<unknown>;
  get(sid: string, cb?: Callback): Promise<unknown>;
}

/**
 * Remembers the stored idle deadline read with each session and skips the touch when the new deadline is less than
 * a minute later: the row is then written at most once a minute per session, however busy the console.
 */
function touchAtMostEveryMinute(store: StoreInternals) {
  const storedExpiry = new Map<string, number>();
  const touch = store.touch.bind(store);
  store.get = (sid, cb) => {
    const found = store.query('SELECT data, expires FROM sessions WHERE session_id = ?', [sid]).then(([rows]) => {
      const row = rows[0];
      if (!row || row.expires < Math.round(Date.now() / 1000)) return null;
      // Bounded: a request that neither touches nor saves (an error, a sign-out) leaves its entry behind.
      if (storedExpiry.size > 10_000) storedExpiry.clear();
      storedExpiry.set(sid, Number(row.expires));
      return typeof row.data === 'string' ? JSON.parse(row.data) : row.data;
    });
    return cb ? found.then((d) => cb(null, d), cb) : found;
  };
  store.touch = (sid, sess, cb) => {
    const stored = storedExpiry.get(sid);
    storedExpiry.delete(sid);
    const next = sess.cookie?.expires ? Math.round(new Date(sess.cookie.expires).getTime() / 1000) : Infinity;
    if (stored !== undefined && next - stored < TOUCH_EVERY_SECONDS) {
      cb?.();
      return Promise.resolve();
    }
    return touch(sid, sess, cb);
  };
}

export function createSessionSetup(env: Env): SessionSetup {
  const uri = env.DATABASE_URL.replace(/^mariadb:/, 'mysql:');
  const pool = mysql.createPool({ uri, connectionLimit: 10 });
  const MySQLStore = MySQLStoreFactory(session as unknown as Parameters<typeof MySQLStoreFactory>[0]);
  const store = new MySQLStore(
    {
      createDatabaseTable: false,
      clearExpired: true,
      checkExpirationInterval: 15 * 60_000,
      schema: { tableName: 'sessions', columnNames: { session_id: 'session_id', expires: 'expires', data: 'data' } },
    },
    // The store's types expect its own mysql2 build; the pool is the same library.
    pool as unknown as ConstructorParameters<typeof MySQLStore>[1],
  );
  touchAtMostEveryMinute(store as unknown as StoreInternals);

  const production = env.NODE_ENV === 'production';
  const cookieName = sessionCookieName(env);
  const middleware = session({
    name: cookieName,
    secret: env.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true, // the idle timeout restarts with activity (the stored deadline within a minute, see above)
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: production,
      path: '/',
      maxAge: env.SESSION_IDLE_MINUTES * 60_000,
    },
  });

  const absoluteMs = env.SESSION_ABSOLUTE_HOURS * 3_600_000;
  const enforceAbsoluteTimeout: RequestHandler = (req, _res, next) => {
    const started = req.session?.signedInAt;
    if (started && Date.now() - started > absoluteMs) {
      // Regenerate, not destroy: the stored session goes, but later middleware (passport, CSRF) still needs a
      // session object, and meets an empty, signed-out one instead of crashing on a missing req.session.
      req.session.regenerate((err) => next(err));
      return;
    }
    next();
  };

  return {
    middleware,
    enforceAbsoluteTimeout,
    pool,
    dbName: decodeURIComponent(new URL(uri).pathname.replace(/^\//, '')),
    cookieName,
    async close() {
      await store.close().catch(() => undefined);
      await pool.end().catch(() => undefined);
    },
  };
}
