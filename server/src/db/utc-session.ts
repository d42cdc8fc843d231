// Every database session runs in UTC: TypeORM's `timezone: 'Z'` only tells the driver how to convert JavaScript dates,
// while NOW(), CURRENT_TIMESTAMP and TIMESTAMP columns follow the session's time_zone, which defaults to the server's.
import type { DataSource } from 'typeorm';

interface PoolLike {
  on(event: 'connection', listener: (connection: { query(sql: string): unknown }) => void): void;
  getConnection(cb: (err: Error | null, connection: { release(): void }) => void): void;
  end(cb: () => void): void;
}
interface MysqlDriverLike {
  mysql: { createPool(options: object): PoolLike };
  createPool(options: object): Promise<PoolLike>;
}

export const UTC_SESSION_SQL = "SET time_zone = '+00:00'";

/**
 * Wraps the driver's pool factory so that each new connection runs the SET before anything else: the pool emits
 * `connection` as a connection opens, and a connection runs its queries in order.
 */
export function pinSessionsToUtc(ds: DataSource): DataSource {
  const driver = ds.driver as unknown as MysqlDriverLike;
  driver.createPool = (options: object) => {
    const pool = driver.mysql.createPool(options);
    pool.on('connection', (connection) => {
      connection.query(UTC_SESSION_SQL);
    });
    // The same first-connection check the driver makes, so wrong credentials still fail at start.
    return new Promise((resolve, reject) => {
      pool.getConnection((err, connection) => {
        if (err) return pool.end(() => reject(err));
        connection.release();
        resolve(pool);
      });
    });
  };
  return ds;
}
