// Loads the demo on an empty database, refreshes a stale one; refuses to run in production.
import { createDataSource } from '../db/data-source';
import { demoIsStale, isEmpty, loadDemo, refreshDemoFlights } from './load-demo';

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
await db.destroy();
