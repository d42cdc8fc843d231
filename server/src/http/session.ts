// Sessions live in MariaDB so a restart signs nobody out, with idle and absolute time limits.
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
  close(): Promise<void>;
}

export function createSessionSetup(env: Env): SessionSetup {
  const pool = mysql.createPool({ uri: env.DATABASE_URL.replace(/^mariadb:/, 'mysql:'), connectionLimit: 10 });
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

  const middleware = session({
    name: 'bumpboard.sid',
    secret: env.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true, // the idle timeout restarts with every request
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: env.NODE_ENV === 'production',
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
    async close() {
      await store.close().catch(() => undefined);
      await pool.end().catch(() => undefined);
    },
  };
}
