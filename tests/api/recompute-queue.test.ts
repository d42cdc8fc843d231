// The queue of flights to recompute, on the real MariaDB, with two data sources standing for two server processes.
// Hand-worked cases: one row per flight however often it is asked for; a claim is exclusive and skips a row another
// claimer has locked instead of waiting; a flight asked for during its recompute goes back into the line behind the
// flights that waited longer, for the claimer that ran it (the latest wins, and nobody starves); a dead claimer's
// flights are taken again after its lease, and its late finish changes nothing.
// Outside source: MariaDB documentation "SELECT ... FOR UPDATE SKIP LOCKED" (10.6+: locked rows are passed over),
// from memory.
import 'reflect-metadata';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadEnv } from '../../server/src/config/env';
import { createDataSource } from '../../server/src/db/data-source';
import { createForecastScheduler, type Recompute } from '../../server/src/modules/forecast/forecast-scheduler';
import { mariadbRecomputeQueue } from '../../server/src/modules/forecast/recompute-queue';
import { createFlight, removeDenialFixtures } from './denials-fixtures';
import { RUN_ID } from './helpers';

let one: DataSource;
let two: DataSource;
let serial = 0;
const claimer = (who: string) => `test-${who}-${RUN_ID}-${++serial}`;

beforeAll(async () => {
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', SESSION_SECRET: 'test-secret-test-secret-test-secret-42', STATIC_DIR: 'none' });
  one = createDataSource(env.DATABASE_URL);
  two = createDataSource(env.DATABASE_URL);
  await Promise.all([one.initialize(), two.initialize()]);
});
afterAll(async () => {
  await removeDenialFixtures(one);
  await Promise.all([one.destroy(), two.destroy()]);
});

const newFlight = async () => (await createFlight(one, { station: 'BOS', destination: 'ORD', seats: 2 })).id;
const rowOf = async (flightId: number) => {
  const [row] = await one.query('SELECT requests, only_if_moved, claimed_by FROM forecast_recompute_queue WHERE flight_id = ?', [flightId]);
  return row ? { requests: Number(row.requests), onlyIfMoved: Number(row.only_if_moved) === 1, claimedBy: row.claimed_by as string | null } : null;
};

describe('the recompute queue', () => {
  it('keeps one row per flight however often it is asked, and a full ask outweighs the clock’s', async () => {
    const flight = await newFlight();
    const a = mariadbRecomputeQueue(one, { claimer: claimer('a') });
    await a.mark([flight], true);
    await a.mark([flight, flight], true);
    // Hand count: two statements, the second names the flight twice → 2 requests, still only the clock's.
    expect(await rowOf(flight)).toEqual({ requests: 2, onlyIfMoved: true, claimedBy: null });
    await a.mark([flight], false);
    expect(await rowOf(flight)).toMatchObject({ requests: 3, onlyIfMoved: false });
    expect(await a.claim(10)).toContainEqual({ flightId: flight, onlyIfMoved: false });
    expect(await a.finish({ flightId: flight, onlyIfMoved: false })).toBe(false);
    expect(await rowOf(flight)).toBeNull();
  });

  it('passes over a flight that no longer exists instead of failing the others', async () => {
    const flight = await newFlight();
    const a = mariadbRecomputeQueue(one, { claimer: claimer('a') });
    await a.mark([flight, 2_147_483_000], false);
    expect(await rowOf(flight)).toMatchObject({ requests: 1 });
    expect(await rowOf(2_147_483_000)).toBeNull();
    await a.claim(10);
    await a.finish({ flightId: flight, onlyIfMoved: false });
  });

  it('gives a flight to one claimer at a time; a row being claimed elsewhere is skipped, not waited for', async () => {
    const flight = await newFlight();
    const a = mariadbRecomputeQueue(one, { claimer: claimer('a'), leaseMs: 60_000 });
    await a.mark([flight], false);
    // Another process is in the middle of claiming it: its transaction holds the row.
    const runner = two.createQueryRunner();
    await runner.connect();
    await runner.startTransaction('READ COMMITTED');
    await runner.query('SELECT flight_id FROM forecast_recompute_queue WHERE flight_id = ? FOR UPDATE', [flight]);
    try {
      expect((await a.claim(10)).map((c) => c.flightId)).not.toContain(flight);
    } finally {
      await runner.rollbackTransaction();
      await runner.release();
    }
    const claimed = await a.claim(10);
    expect(claimed).toContainEqual({ flightId: flight, onlyIfMoved: false });
    // Claimed: nobody, the claimer itself included, gets it again while the lease holds.
    expect((await a.claim(10)).map((c) => c.flightId)).not.toContain(flight);
    await a.finish({ flightId: flight, onlyIfMoved: false });
  });

  it('puts a flight asked for during its recompute back into the line, behind a flight that waited longer', async () => {
    const flight = await newFlight();
    const waiting = await newFlight();
    const a = mariadbRecomputeQueue(one, { claimer: claimer('a') });
    const b = mariadbRecomputeQueue(two, { claimer: claimer('b') });
    await a.mark([flight], true);
    const [claim] = (await a.claim(10)).filter((c) => c.flightId === flight);
    expect(claim).toEqual({ flightId: flight, onlyIfMoved: true });
    // While it runs, another process asks twice (a check-in, then the clock), and a second flight is asked for.
    await b.mark([flight], false);
    await b.mark([flight], true);
    await a.mark([waiting], false);
    expect((await b.claim(10)).map((c) => c.flightId)).not.toContain(flight);
    // The line is ordered by the database clock's milliseconds: let it pass the second flight's ask.
    await expect.poll(async () => Number((await one.query('SELECT UTC_TIMESTAMP(3) > requested_at AS later FROM forecast_recompute_queue WHERE flight_id = ?', [waiting]))[0].later)).toBe(1);
    // The first recompute ends: the row stays for both asks, unclaimed, asked by the claimer as of now.
    expect(await a.finish(claim)).toBe(true);
    expect(await rowOf(flight)).toMatchObject({ requests: 3, claimedBy: null });
    // The flight that waited longer comes first; then the busy one, as a full recompute (one of its asks was full).
    const next = (await a.claim(10)).filter((c) => c.flightId === flight || c.flightId === waiting);
    expect(next).toEqual([{ flightId: waiting, onlyIfMoved: false }, { flightId: flight, onlyIfMoved: false }]);
    expect(await a.finish(next[0])).toBe(false);
    expect(await a.finish(next[1])).toBe(false);
    expect(await rowOf(flight)).toBeNull();
    expect(await rowOf(waiting)).toBeNull();
  });

  it('hands a dead claimer’s flight to another after its lease, and the late finish of the dead one changes nothing', async () => {
    const flight = await newFlight();
    const dead = mariadbRecomputeQueue(one, { claimer: claimer('dead'), leaseMs: 300 });
    const alive = mariadbRecomputeQueue(two, { claimer: claimer('alive'), leaseMs: 60_000 });
    await dead.mark([flight], false);
    const [claim] = (await dead.claim(10)).filter((c) => c.flightId === flight);
    expect(claim).toBeDefined();
    // Asked again while the claimer hangs: the ask is kept with the claim's, so the full one is not lost.
    await dead.mark([flight], true);
    expect((await alive.claim(10)).map((c) => c.flightId)).not.toContain(flight);
    let taken: { flightId: number; onlyIfMoved: boolean } | undefined;
    await expect.poll(async () => {
      taken ??= (await alive.claim(10)).find((c) => c.flightId === flight);
      return taken;
    }, { timeout: 10_000 }).toEqual({ flightId: flight, onlyIfMoved: false });
    expect(await dead.finish(claim)).toBe(false);
    expect(await rowOf(flight)).toMatchObject({ claimedBy: expect.stringContaining('test-alive-') });
    expect(await alive.finish(taken!)).toBe(false);
    expect(await rowOf(flight)).toBeNull();
  });

  it('lets another process take a flight its asker never claimed (it died first) once a lease has passed', async () => {
    const flight = await newFlight();
    const dead = mariadbRecomputeQueue(one, { claimer: claimer('dead'), leaseMs: 300 });
    const alive = mariadbRecomputeQueue(two, { claimer: claimer('alive'), leaseMs: 300 });
    await dead.mark([flight], false);
    expect((await alive.claim(10)).map((c) => c.flightId)).not.toContain(flight);
    let taken: { flightId: number } | undefined;
    await expect.poll(async () => {
      taken ??= (await alive.claim(10)).find((c) => c.flightId === flight);
      return taken?.flightId;
    }, { timeout: 10_000 }).toBe(flight);
    expect(await alive.finish({ flightId: flight, onlyIfMoved: false })).toBe(false);
  });
});

describe('two schedulers on one queue', () => {
  it('never run one flight twice at once, and every ask is followed by a recompute that started after it', async () => {
    const flights = [await newFlight(), await newFlight(), await newFlight()];
    const running = new Map<number, number>();
    const started: { flightId: number; at: number }[] = [];
    let overlap = false;
    let clock = 0;
    const recompute: Recompute = async (flightId) => {
      running.set(flightId, (running.get(flightId) ?? 0) + 1);
      if (running.get(flightId)! > 1) overlap = true;
      started.push({ flightId, at: ++clock });
      await new Promise((r) => setTimeout(r, 5));
      running.set(flightId, running.get(flightId)! - 1);
      return { status: 'unmoved' };
    };
    const a = createForecastScheduler(one, () => undefined, { recompute, queue: mariadbRecomputeQueue(one, { claimer: claimer('a') }) });
    const b = createForecastScheduler(two, () => undefined, { recompute, queue: mariadbRecomputeQueue(two, { claimer: claimer('b') }) });
    const asked: { flightId: number; at: number }[] = [];
    for (let i = 0; i < 60; i++) {
      const flightId = flights[i % 3];
      asked.push({ flightId, at: ++clock });
      (i % 2 ? a : b).markDirty(flightId);
      if (i % 7 === 0) await new Promise((r) => setTimeout(r, 3));
    }
    await Promise.all([a.flush(), b.flush()]);
    await Promise.all([a.flush(), b.flush()]);
    expect(overlap).toBe(false);
    for (const ask of asked) expect(started.some((s) => s.flightId === ask.flightId && s.at > ask.at)).toBe(true);
    // Coalesced: far fewer recomputes than asks.
    expect(started.length).toBeLessThan(asked.length);
    for (const f of flights) expect(await rowOf(f)).toBeNull();
  });
});
