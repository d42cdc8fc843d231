// Loads the demo on an empty database, refreshes a stale one; refuses to run in production.
import { createDataSource } from '../db/data-source';
import { writeFileSync } from 'node:fs';
import { createDemoFeedKeys, demoIsStale, isEmpty, loadDemo, refreshDemoFlights } from './load-demo';

if (process.env.NODE_ENV === 'production') {
  console.error('[demo] refused: NODE_ENV=production. The demo scenario is for trying Bumpboard out, never for a live station.');
  process.exit(1);
}
const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is required');
const db = createDataSource(url);
await db.initialize();
if (await isEmpty(db)) {
  await loadDemo(db);
  console.log('[demo] loaded the demo scenario (invented carrier, people and flights)');
} else if (process.env.DEMO_REFRESH === '1' || (await demoIsStale(db))) {
  await refreshDemoFlights(db);
  console.log('[demo] refreshed the demo flights for the current time');
}
const keysFile = process.env.DEMO_KEYS_FILE;
if (keysFile) {
  // Fresh keys at every start: the file is the only place they exist in clear.
  writeFileSync(keysFile, JSON.stringify(await createDemoFeedKeys(db), null, 2), { mode: 0o600 });
}
await db.destroy();
