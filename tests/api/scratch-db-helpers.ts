// A database of its own for a test that must see a whole schema change or rewrite every flight, so the shared test
// database and the other test files are untouched. The test user may create databases named `bumpboard_*`.
import { randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { createDataSource } from '../../server/src/db/data-source';

export interface ScratchDatabase {
  db: DataSource;
  url: string;
  drop(): Promise<void>;
}

/** Creates `bumpboard_<label>_<random>` beside the shared test database, reached through the same account. */
export async function scratchDatabase(shared: DataSource, label: string): Promise<ScratchDatabase> {
  const name = `bumpboard_${label}_${randomBytes(4).toString('hex')}`;
  await shared.query(`CREATE DATABASE \`${name}\``);
  const url = new URL(process.env.DATABASE_URL!);
  url.pathname = `/${name}`;
  const db = createDataSource(url.toString());
  await db.initialize();
  return {
    db,
    url: url.toString(),
    async drop() {
      if (db.isInitialized) await db.destroy();
      await shared.query(`DROP DATABASE IF EXISTS \`${name}\``);
    },
  };
}
