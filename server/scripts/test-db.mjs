// `node server/scripts/test-db.mjs`: the test instance's MariaDB, migrated with the demo loaded, kept up until Ctrl-C,
// so one API test file can run on its own while working:
//   DATABASE_URL=$(cat .local/test/database-url) node_modules/.bin/vitest run --project api tests/api/users.test.ts
// TEST_PORT moves it exactly as it moves `npm test` (database on TEST_PORT + 10).
import { writeFileSync } from 'node:fs';
import { migrateAndLoadDemo, startDatabase } from './lib/stack.mjs';
import { say } from './lib/log.mjs';

const local = '.local/test';
const base = Number(process.env.TEST_PORT ?? 4700);
const db = await startDatabase({ local, dbPort: base + 10 });
if (process.argv.includes('--reset') && !process.env.DATABASE_URL) db.resetDatabase();
migrateAndLoadDemo(db.url, { local });
writeFileSync(`${local}/database-url`, db.url, { mode: 0o600 });
say('test-db', `ready: DATABASE_URL in ${local}/database-url (Ctrl-C stops it)`);

async function stop() {
  await db.stop();
  process.exit(0);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
setInterval(() => {}, 60_000);
