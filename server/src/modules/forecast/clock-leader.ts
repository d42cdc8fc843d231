// One process ticks the forecast clock: the one holding a MariaDB named lock on a connection of its own. The lock
// lives and dies with that connection, so when the process dies (or its connection drops) the server releases it,
// and the next process to try takes over at its next tick. Alone (`npm start`), the process always holds it.
import type { DataSource, QueryRunner } from 'typeorm';

export interface Leadership {
  /** Whether this process holds the lock now, taking it if it is free. Never throws: a broken connection is "no". */
  isLeader(): Promise<boolean>;
  /** The database's id of the connection holding the lock, if this process holds it (tests kill it). */
  connectionId(): number | null;
  release(): Promise<void>;
}

export const alwaysLeader: Leadership = { isLeader: async () => true, connectionId: () => null, release: async () => undefined };

export function namedLockLeader(db: DataSource, name = 'bumpboard.forecast-clock'): Leadership {
  let runner: QueryRunner | null = null;
  let connection: number | null = null;
  let held = false;

  const drop = async () => {
    held = false;
    connection = null;
    const r = runner;
    runner = null;
    await r?.release().catch(() => undefined);
  };

  return {
    async isLeader() {
      try {
        if (!runner) {
          runner = db.createQueryRunner();
          await runner.connect();
          const [row]: { id: number | string }[] = await runner.query('SELECT CONNECTION_ID() AS id');
          connection = Number(row.id);
        }
        if (held) {
          // Still ours? A connection killed under us answers with an error, handled below.
          const [row]: { holder: number | string | null }[] = await runner.query('SELECT IS_USED_LOCK(?) AS holder', [name]);
          if (row.holder !== null && Number(row.holder) === connection) return true;
        }
        const [row]: { got: number | string | null }[] = await runner.query('SELECT GET_LOCK(?, 0) AS got', [name]);
        held = Number(row.got) === 1;
        return held;
      } catch {
        await drop();
        return false;
      }
    },
    connectionId: () => (held ? connection : null),
    async release() {
      if (runner && held) await runner.query('SELECT RELEASE_LOCK(?)', [name]).catch(() => undefined);
      await drop();
    },
  };
}
