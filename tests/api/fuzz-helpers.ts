// What the fuzz tests share: the real app on a database of its own (migrated, demo loaded), so random requests that
// happen to be valid change nothing the other test files read; a one-query snapshot of every table's row count; and
// the generators of hostile and near-valid input.
import 'reflect-metadata';
import fc from 'fast-check';
import { expect } from 'vitest';
import type { Response } from 'supertest';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { loadEnv } from '../../server/src/config/env';
import { createApp } from '../../server/src/app';
import { createSessionSetup } from '../../server/src/http/session';
import { createSignInThrottle } from '../../server/src/modules/auth/throttle';
import { loadDemo } from '../../server/src/demo/load-demo';
import { Client, DEMO_PASSWORD } from './harness';
import { DEMO } from './helpers';
import { scratchDatabase, type ScratchDatabase } from './scratch-db-helpers';
import type { Role } from '@shared/schemas/common';
import { createLearningRuntime } from '../../server/src/modules/learning/learning-runtime';

export interface FuzzApp {
  app: ReturnType<typeof createApp>;
  db: DataSource;
  /** Work an accepted request leaves running (a training run): waited for before rows are counted again. */
  idle(): Promise<void>;
  close(): Promise<void>;
}

/** The app exactly as the server builds it, on a fresh scratch database with the demo loaded. */
export async function startFuzzApp(shared: DataSource, label: string): Promise<FuzzApp> {
  const scratch: ScratchDatabase = await scratchDatabase(shared, label);
  await scratch.db.runMigrations({ transaction: 'each' });
  await loadDemo(scratch.db);
  const env = loadEnv({ ...process.env, DATABASE_URL: scratch.url, NODE_ENV: 'test', SESSION_SECRET: 'fuzz-secret-fuzz-secret-fuzz-secret-4242', STATIC_DIR: 'no-static-in-api-tests' });
  const session = createSessionSetup(env);
  const learning = createLearningRuntime(scratch.db, {});
  const app = createApp({ env, db: scratch.db, session, learning, throttle: createSignInThrottle({ perAccount: 100_000, perAddress: 1_000_000 }), demo: true });
  return {
    app,
    db: scratch.db,
    idle: () => learning.idle(),
    async close() {
      await learning.idle();
      await session.close();
      await scratch.drop();
    },
  };
}

export async function signedInAs(f: FuzzApp, role: Role): Promise<Client> {
  const c = new Client(f.app);
  const res = await c.signIn(DEMO[role], DEMO_PASSWORD);
  if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status}`);
  return c;
}

/**
 * Every table's row count in one round trip. Left out: sessions (a sign-in is a write by design), and the forecast
 * figures, a cache of numbers derived from the manifest that a read may fill and the scheduler refreshes at any time.
 */
export async function rowCounter(db: DataSource): Promise<() => Promise<Record<string, number>>> {
  const tables: { t: string }[] = await db.query(
    `SELECT TABLE_NAME AS t FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_TYPE = 'BASE TABLE' AND TABLE_NAME NOT IN ('sessions', 'migrations', 'flight_forecasts', 'forecast_snapshots') ORDER BY TABLE_NAME`,
  );
  const sql = `SELECT ${tables.map(({ t }) => `(SELECT COUNT(*) FROM \`${t}\`) AS \`${t}\``).join(', ')}`;
  return async () => {
    const [row] = await db.query(sql);
    return Object.fromEntries(Object.entries(row as Record<string, string>).map(([k, v]) => [k, Number(v)]));
  };
}

/** A refusal is ours: a JSON body with a snake_case code, a sentence, and for a 400 the field and the rule. */
export function expectStructuredRefusal(res: Response, what: string): void {
  expect(res.status, `${what} answered ${res.status}: ${JSON.stringify(res.body).slice(0, 300)}`).toBeLessThan(500);
  if (res.status < 400) return;
  expect(res.body?.error, `${what}: no error code in ${JSON.stringify(res.body).slice(0, 200)}`).toMatch(/^[a-z][a-z0-9_]*$/);
  expect(typeof res.body?.message, what).toBe('string');
  if (res.status !== 400) return;
  const details = res.body.details as { field?: unknown; rule?: unknown }[] | undefined;
  expect(Array.isArray(details) && details.length > 0, `${what}: a 400 without details naming the field: ${JSON.stringify(res.body)}`).toBe(true);
  for (const d of details!) {
    expect(typeof d.field === 'string' && d.field.length > 0, `${what}: detail without a field ${JSON.stringify(d)}`).toBe(true);
    expect(typeof d.rule === 'string' && d.rule.length > 0, `${what}: detail without a rule ${JSON.stringify(d)}`).toBe(true);
  }
}

/** Field names the API reads anywhere, collected from the shared schemas, so near-valid bodies reach deep checks. */
export async function schemaFieldNames(): Promise<string[]> {
  const modules = import.meta.glob('../../shared/schemas/*.ts');
  const names = new Set<string>();
  const visit = (s: unknown, depth: number) => {
    if (depth > 4 || !(s instanceof z.ZodType)) return;
    const def = (s as unknown as { def?: { type?: string; shape?: Record<string, unknown>; element?: unknown; innerType?: unknown; options?: unknown[] } }).def;
    if (!def) return;
    if (def.type === 'object' && def.shape) {
      for (const [k, v] of Object.entries(def.shape)) {
        names.add(k);
        visit(v, depth + 1);
      }
    }
    for (const inner of [def.element, def.innerType, ...(def.options ?? [])]) visit(inner, depth + 1);
  };
  for (const load of Object.values(modules)) for (const v of Object.values((await load()) as Record<string, unknown>)) visit(v, 0);
  return [...names].sort();
}

/** Values that break parsers, coercions, SQL and JSON columns in their own ways. */
export const hostileScalar: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(
    '', ' ', '0', '-1', '1e309', 'NaN', 'Infinity', 'null', 'undefined', 'true', '[]', '{}', '__proto__', 'constructor',
    "' OR 1=1 --", '"; DROP TABLE flights; --', '%00', '\u0000', '\uD800', '../../etc/passwd', '<script>alert(1)</script>',
    '2026-02-30T25:61:00Z', '9999-12-31T23:59:59Z', '0000-00-00', 'ZZ', 'BOS', 'ZZZZ', 'a'.repeat(5000),
    -1, 0, 1, 2 ** 31, -(2 ** 31) - 1, 2 ** 53, 1.5, -0.0001, Number.MAX_SAFE_INTEGER, 1e21, true, false, null,
  ),
  fc.integer(),
  fc.double({ noNaN: false }),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 20 }),
  fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
);

/** JSON bodies: random trees, and objects built from the API's own field names with hostile or plausible values. */
export function bodyArbitrary(fields: string[]): fc.Arbitrary<unknown> {
  const value: fc.Arbitrary<unknown> = fc.oneof(
    { weight: 4, arbitrary: hostileScalar },
    { weight: 1, arbitrary: fc.array(hostileScalar, { maxLength: 5 }) },
    { weight: 1, arbitrary: fc.array(fc.integer({ min: -5, max: 3000 }), { maxLength: 5 }) },
    { weight: 1, arbitrary: fc.dictionary(fc.constantFrom(...fields), hostileScalar, { maxKeys: 4 }) },
  );
  return fc.oneof(
    { weight: 6, arbitrary: fc.dictionary(fc.constantFrom(...fields), value, { maxKeys: 8 }) },
    { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
    { weight: 1, arbitrary: fc.dictionary(fc.string({ maxLength: 12 }), value, { maxKeys: 5 }) },
  );
}

/** Percent-encodes anything, lone surrogates included (replaced, since no URL can carry them). */
const enc = (v: unknown) => encodeURIComponent(String(v).replace(/[\uD800-\uDFFF]/g, '\uFFFD'));

/** Escapes no decoder accepts, sent as they are. */
const brokenEscapes = fc.constantFrom('%', '%zz', '%E0%A4%A', '%C0%AF', '%FF%FE', '%uD800');

/** A path parameter: sometimes a real id of the demo, mostly something that is not an id at all. */
export function paramArbitrary(realIds: number[]): fc.Arbitrary<string> {
  return fc.oneof(
    { weight: 2, arbitrary: fc.constantFrom(...realIds.map(String)) },
    { weight: 3, arbitrary: hostileScalar.map((v) => enc(v).slice(0, 400) || '%20') },
    { weight: 1, arbitrary: brokenEscapes },
    { weight: 1, arbitrary: fc.integer({ min: -10, max: 100_000 }).map(String) },
  );
}

/** A query string of the API's field names (and some not) with hostile values, repeated keys included. */
export function queryArbitrary(fields: string[]): fc.Arbitrary<string> {
  return fc
    .array(fc.tuple(fc.oneof(fc.constantFrom(...fields), fc.string({ maxLength: 8 })), fc.oneof(hostileScalar.map(enc), brokenEscapes)), { maxLength: 5 })
    .map((pairs) => pairs.map(([k, v]) => `${enc(k)}=${v}`.slice(0, 600)).join('&'));
}
