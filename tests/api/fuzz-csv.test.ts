// Property-based fuzzing of the manifest upload (preview and import): broken CSV of every kind, hostile cells,
// wrong headers, bytes that are not text, wrong file types. Properties: never a 5xx; every refusal is our own JSON
// and a 400 names the field (or line) and the rule; nothing is written. The station has no flights, so no file can
// be valid and every import must be refused.
// Outside sources, from memory: RFC 4180 (CSV: quoted cells, doubled quotes, CR LF); OWASP CSV Injection page
// (cells starting with = + - @); OWASP File Upload Cheat Sheet; fast-check documentation (`fc.asyncProperty`).
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MANIFEST_COLUMNS } from '@shared/schemas/manifest';
import { StationEntity } from '../../server/src/db/entities';
import { Client, startTestApp, upload, type TestApp } from './harness';
import { TEST_PASSWORD, insertUser, removeRunUsers } from './helpers';
import { expectStructuredRefusal, hostileScalar, rowCounter } from './fuzz-helpers';

const CASES = Number(process.env.FUZZ_CSV_CASES ?? 300);
const SEED = Number(process.env.FUZZ_SEED ?? 20261203);

let t: TestApp;
let admin: Client;
let station: StationEntity;
let counts: () => Promise<Record<string, number>>;
const tally = { cases: 0, byStatus: {} as Record<number, number> };

beforeAll(async () => {
  t = await startTestApp();
  const repo = t.db.getRepository(StationEntity);
  // Stavanger, a real Norwegian airport: a station of this test alone, with no flights, made once and reused.
  station = (await repo.findOneBy({ iata: 'SVG' })) ?? (await repo.save(repo.create({ iata: 'SVG', name: 'Stavanger (CSV fuzz station)', timeZone: 'Europe/Oslo', regime: 'eu-261', currency: 'NOK' })));
  const user = await insertUser(t.db, { label: 'csv-fuzz', role: 'admin', stationIds: [station.id] });
  admin = new Client(t.app);
  expect((await admin.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
  counts = await rowCounter(t.db);
}, 120_000);

afterAll(async () => {
  console.log(`[fuzz-csv] ${tally.cases} uploads, seed ${SEED}; statuses ${JSON.stringify(tally.byStatus)}`);
  await removeRunUsers(t.db);
  await t.close();
});

/** A cell as a spreadsheet or a hostile sender writes it: quotes, separators and line breaks inside, formulas. */
const cell: fc.Arbitrary<string> = fc.oneof(
  hostileScalar.map((v) => String(v)),
  fc.constantFrom('=HYPERLINK("http://x")', '+1+1', '-2+3', '@SUM(A1)', '"', '""', '"a,b"', 'a\r\nb', '\uFEFF', 'ZZ', '105', '2026-12-03', 'Y', 'USD', 'true'),
  fc.string({ maxLength: 30 }),
);

const header = fc.oneof(
  { weight: 4, arbitrary: fc.constant([...MANIFEST_COLUMNS] as string[]) },
  { weight: 1, arbitrary: fc.shuffledSubarray([...MANIFEST_COLUMNS] as string[]) },
  { weight: 1, arbitrary: fc.array(fc.oneof(fc.constantFrom(...MANIFEST_COLUMNS), fc.string({ maxLength: 10 })), { maxLength: 20 }) },
);

const quote = (c: string) => (/[",\r\n]/.test(c) && !c.startsWith('"') ? `"${c.replace(/"/g, '""')}"` : c);

const csvFile: fc.Arbitrary<string | Buffer> = fc.oneof(
  { weight: 6, arbitrary: fc.tuple(header, fc.array(fc.array(cell, { maxLength: 22 }), { maxLength: 6 }), fc.constantFrom('\r\n', '\n', '\r', ';'))
    .map(([h, rows, eol]) => [h.join(','), ...rows.map((r) => r.map(quote).join(','))].join(eol)) },
  { weight: 1, arbitrary: fc.uint8Array({ maxLength: 400 }).map((bytes) => Buffer.from(bytes)) },
  { weight: 1, arbitrary: fc.string({ maxLength: 400 }) },
);

const fileMeta = fc.record({
  name: fc.constantFrom('manifest.csv', 'manifest.CSV', 'manifest.xlsx', 'manifest', '../../etc/passwd', 'm\u0000.csv', `${'a'.repeat(300)}.csv`),
  type: fc.constantFrom('text/csv', 'application/vnd.ms-excel', 'application/octet-stream', 'text/plain', 'image/png'),
  field: fc.constantFrom('file', 'file', 'file', 'manifest', 'upload'),
});

describe('fuzzing the manifest upload', () => {
  it.each(['preview', 'import'] as const)('%s: never a 5xx, a refusal in our words naming the field, nothing written', async (what) => {
    await fc.assert(
      fc.asyncProperty(csvFile, fileMeta, async (content, meta) => {
        const before = await counts();
        const res = await upload(admin, `/api/stations/${station.id}/manifests/${what}`, { ...meta, content });
        tally.cases += 1;
        tally.byStatus[res.status] = (tally.byStatus[res.status] ?? 0) + 1;
        const label = `${what} ${meta.name} (${meta.type}, field ${meta.field}): ${String(content).slice(0, 200)}`;
        expectStructuredRefusal(res, label);
        if (what === 'import') expect(res.status, label).toBeGreaterThanOrEqual(400);
        expect(await counts(), `${label} wrote rows`).toEqual(before);
      }),
      { numRuns: CASES, seed: SEED, endOnFailure: true },
    );
  }, 900_000);
});
