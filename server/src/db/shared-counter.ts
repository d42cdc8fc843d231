// The counters behind every throttle (rate-limiter-flexible). With the server's MariaDB pool they are rows of one
// table, so every server process counts together and a restart hands a guesser no fresh allowance; without it (unit
// tests, scripts) they live in this process's memory.
import type { Pool } from 'mysql2';
import { RateLimiterMemory, RateLimiterMySQL, type RateLimiterAbstract } from 'rate-limiter-flexible';

/** The table the counters live in (created by migration; rate-limiter-flexible's own layout: key, points, expire). */
export const COUNTER_TABLE = 'sign_in_throttle';

export interface CounterStore {
  pool: Pool;
  dbName: string;
}

export function sharedCounter(store: CounterStore | undefined, opts: { keyPrefix: string; points: number; duration: number }): RateLimiterAbstract {
  return store
    ? new RateLimiterMySQL({ storeClient: store.pool, storeType: 'pool', dbName: store.dbName, tableName: COUNTER_TABLE, tableCreated: true, ...opts })
    : new RateLimiterMemory(opts);
}
