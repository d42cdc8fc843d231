// The one claim helper every worker uses, on the real MariaDB, with two data sources standing for two server
// processes and a table of its own. Hand-worked cases: which due rows a claim takes, in what order and how many;
// two claimers racing over the same rows never both take one; a claim keeps everyone else off until its lease ends,
// then a live claimer takes a dead one's rows, and the dead one's late finish writes nothing.
// Outside source: MariaDB documentation "SELECT ... FOR UPDATE SKIP LOCKED" (10.6+: rows locked by another
// transaction are passed over instead of waited for), from memory.
import 'reflect-metadata';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { loadEnv } from '../../server/src/config/env';
import { rowClaimer } from '../../server/src/db/claim-rows';
import { createDataSource } from '../../server/src/db/data-source';
import { RUN_ID } from './helpers';

let one: DataSource;
let two: DataSource;
/** A table of this run only: the helper takes any table with the two claim columns. */
const TABLE = `test_claims_${RUN_ID}`;
const spec = { table: TABLE, key: 'id' };

beforeAll(async () => {
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', SESSION_SECRET: 'test-secret-test-secret-test-secret-42', STATIC_DIR: 'none' });
  one = createDataSource(env.DATABASE_URL);
  two = createDataSource(env.DATABASE_URL);
  await Promise.all([one.initialize(), two.initialize()]);
  await one.query(
    `CREATE TABLE ${TABLE} (id int NOT NULL PRIMARY KEY, due tinyint NOT NULL, rank_no int NOT NULL, tries int NOT NULL DEFAULT 0,
      done_by varchar(96) NULL, claimed_by varchar(96) NULL, lease_until datetime(3) NULL) ENGINE=InnoDB`,
  );
});
afterAll(async () => {
  await one.query(`DROP TABLE IF EXISTS ${TABLE}`);
  await Promise.all([one.destroy(), two.destroy()]);
});
beforeEach(async () => {
  await one.query(`DELETE FROM ${TABLE}`);
});

async function addRows(rows: { id: number; due?: boolean; rank?: number }[]) {
  await one.query(`INSERT INTO ${TABLE} (id, due, rank_no) VALUES ?`, [rows.map((r) => [r.id, r.due === false ? 0 : 1, r.rank ?? r.id])]);
}
const rowsOf = async (): Promise<{ id: number; tries: number; done_by: string | null; claimed_by: string | null }[]> =>
  one.query(`SELECT id, tries, done_by, claimed_by FROM ${TABLE} ORDER BY id`);
/** Time passing without waiting for it: the claim's lease ends now. */
const lapse = () => one.query(`UPDATE ${TABLE} SET lease_until = UTC_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE lease_until IS NOT NULL`);

describe('claiming rows', () => {
  it('takes the due rows first by the order asked, at most the limit, with the columns asked and the extra set', async () => {
    // Hand-worked: rows 1..7, rows 3 and 6 not due; ranks put 5 first, then 2, 7, 1, 4.
    await addRows([{ id: 1, rank: 40 }, { id: 2, rank: 20 }, { id: 3, due: false, rank: 1 }, { id: 4, rank: 50 }, { id: 5, rank: 10 }, { id: 6, due: false, rank: 2 }, { id: 7, rank: 30 }]);
    const a = rowClaimer(one, spec, `a-${RUN_ID}`);
    const first = await a.claim<{ id: number; rank_no: number }>({ limit: 3, leaseMs: 60_000, due: 'due = ?', dueParams: [1], orderBy: 'rank_no', columns: 'id, rank_no', alsoSet: 'tries = tries + 1' });
    expect(first.rows).toEqual([{ id: 5, rank_no: 10 }, { id: 2, rank_no: 20 }, { id: 7, rank_no: 30 }]);
    expect(first.token.startsWith(`a-${RUN_ID}/`)).toBe(true);
    // The rest of the due rows, not the claimed ones again; and a claim limited to named rows.
    const second = await a.claim<{ id: number }>({ limit: 10, leaseMs: 60_000, due: 'due = 1', orderBy: 'rank_no' });
    expect(second.rows.map((r) => r.id)).toEqual([1, 4]);
    expect(second.token).not.toBe(first.token);
    expect((await a.claim({ limit: 10, leaseMs: 60_000, due: 'due = 1' })).rows).toEqual([]);
    expect((await a.claim({ limit: 10, leaseMs: 60_000, due: 'due = 1', keys: [] })).rows).toEqual([]);
    expect((await a.claim({ limit: 0, leaseMs: 60_000, due: 'due = 1' })).rows).toEqual([]);
    const rows = await rowsOf();
    expect(rows.map((r) => [r.id, r.tries, r.claimed_by])).toEqual([
      [1, 0, second.token], [2, 1, first.token], [3, 0, null], [4, 0, second.token], [5, 1, first.token], [6, 0, null], [7, 1, first.token],
    ]);
    // Finishing sets what it is told in the same fenced statement and frees the row; a second finish finds no claim.
    expect(await a.finish(first.token, 5, 'done_by = ?', ['a'])).toBe(true);
    expect(await a.finish(first.token, 5, 'done_by = ?', ['again'])).toBe(false);
    expect(await a.finish(second.token, 2)).toBe(false); // row 2 is the first claim's, not the second's
    expect((await rowsOf()).find((r) => r.id === 5)).toMatchObject({ done_by: 'a', claimed_by: null });
    // A finished row that is still due is claimable again, by key.
    expect((await a.claim<{ id: number }>({ limit: 5, leaseMs: 60_000, due: 'due = 1', keys: [5, 3] })).rows).toEqual([{ id: 5 }]);
  });

  it('two claimers racing over the same rows never both take one', async () => {
    const N = 60;
    await addRows(Array.from({ length: N }, (_, i) => ({ id: i + 1 })));
    const taken = new Map<number, string>();
    const twice: number[] = [];
    const worker = (db: DataSource, who: string) => async () => {
      const me = rowClaimer(db, spec, `${who}-${RUN_ID}`);
      // Bounded: each pass takes at least one row or ends the loop.
      for (let pass = 0; pass < N; pass++) {
        const claim = await me.claim<{ id: number }>({ limit: 3, leaseMs: 60_000, due: 'done_by IS NULL', alsoSet: 'tries = tries + 1' });
        if (claim.rows.length === 0) return;
        for (const { id } of claim.rows) {
          if (taken.has(id)) twice.push(id);
          taken.set(id, who);
          expect(await me.finish(claim.token, id, 'done_by = ?', [who])).toBe(true);
        }
      }
    };
    // Two lanes per process, four claimers in all, on two connection pools.
    await Promise.all([worker(one, 'one-a')(), worker(one, 'one-b')(), worker(two, 'two-a')(), worker(two, 'two-b')()]);
    expect(twice).toEqual([]);
    const rows = await rowsOf();
    expect(rows.every((r) => r.tries === 1 && r.done_by === taken.get(r.id) && r.claimed_by === null)).toBe(true);
    expect(taken.size).toBe(N);
  });

  it('keeps a claimed row from others until its lease ends; then a live claimer takes it and the dead one writes nothing', async () => {
    await addRows([{ id: 1 }, { id: 2 }, { id: 3 }]);
    const dead = rowClaimer(one, spec, `dead-${RUN_ID}`);
    const live = rowClaimer(two, spec, `live-${RUN_ID}`);
    const held = await dead.claim<{ id: number }>({ limit: 2, leaseMs: 60_000, due: 'done_by IS NULL', alsoSet: 'tries = tries + 1' });
    expect(held.rows.map((r) => r.id)).toEqual([1, 2]);
    // Within the lease the live claimer gets only the row nobody holds.
    const rest = await live.claim<{ id: number }>({ limit: 5, leaseMs: 60_000, due: 'done_by IS NULL', alsoSet: 'tries = tries + 1' });
    expect(rest.rows.map((r) => r.id)).toEqual([3]);
    expect(await live.finish(rest.token, 3, 'done_by = ?', ['live'])).toBe(true);
    // The first claimer is gone; its lease ends.
    await lapse();
    const taken = await live.claim<{ id: number }>({ limit: 5, leaseMs: 60_000, due: 'done_by IS NULL', alsoSet: 'tries = tries + 1' });
    expect(taken.rows.map((r) => r.id)).toEqual([1, 2]);
    // The first claimer wakes up late: its claim no longer holds, nothing it records lands.
    expect(await dead.finish(held.token, 1, 'done_by = ?', ['dead'])).toBe(false);
    for (const id of [1, 2]) expect(await live.finish(taken.token, id, 'done_by = ?', ['live'])).toBe(true);
    expect((await rowsOf()).map((r) => [r.id, r.tries, r.done_by, r.claimed_by])).toEqual([[1, 2, 'live', null], [2, 2, 'live', null], [3, 1, 'live', null]]);
  });

  it('a short lease ends by itself: the rows come back to another claimer', async () => {
    await addRows([{ id: 1 }]);
    const dead = rowClaimer(one, spec, `short-${RUN_ID}`);
    const live = rowClaimer(two, spec, `other-${RUN_ID}`);
    expect((await dead.claim({ limit: 1, leaseMs: 300, due: 'done_by IS NULL' })).rows).toHaveLength(1);
    await expect.poll(async () => (await live.claim<{ id: number }>({ limit: 1, leaseMs: 60_000, due: 'done_by IS NULL' })).rows.map((r) => r.id), { timeout: 10_000, interval: 100 }).toEqual([1]);
  });
});
