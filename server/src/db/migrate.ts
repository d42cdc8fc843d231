// Runs pending migrations against DATABASE_URL; used by the start and test scripts.
import { createDataSource } from './data-source';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is required');
const ds = createDataSource(url);
await ds.initialize();
const ran = await ds.runMigrations({ transaction: 'each' });
for (const m of ran) console.log(`[db] migrated ${m.name}`);
await ds.destroy();
