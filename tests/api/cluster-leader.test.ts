// Several processes share one database: exactly one ticks the forecast clock, by holding a MariaDB named lock on a
// connection of its own, and when that process dies (its connection killed here) the next one to try takes over.
// Two data sources stand for two processes.
import 'reflect-metadata';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadEnv } from '../../server/src/config/env';
import { createDataSource } from '../../server/src/db/data-source';
import { namedLockLeader, type Leadership } from '../../server/src/modules/forecast/clock-leader';
import { createForecastScheduler } from '../../server/src/modules/forecast/forecast-scheduler';
import { RUN_ID } from './helpers';

let one: DataSource;
let two: DataSource;

beforeAll(async () => {
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', SESSION_SECRET: 'test-secret-test-secret-test-secret-42', STATIC_DIR: 'none' });
  one = createDataSource(env.DATABASE_URL);
  two = createDataSource(env.DATABASE_URL);
  await Promise.all([one.initialize(), two.initialize()]);
});
afterAll(async () => {
  await Promise.all([one.destroy(), two.destroy()]);
});

describe('the clock leader', () => {
  it('is one process at a time, and another takes over when the leader’s connection dies', async () => {
    const name = `test-leader-${RUN_ID}`;
    const a = namedLockLeader(one, name);
    const b = namedLockLeader(two, name);
    expect(await a.isLeader()).toBe(true);
    expect(await b.isLeader()).toBe(false);
    expect(await a.isLeader()).toBe(true); // held, not taken twice
    expect(await b.isLeader()).toBe(false);
    // The leader dies: its connection goes, and the lock with it.
    await two.query(`KILL CONNECTION ${a.connectionId()}`);
    await expect.poll(() => b.isLeader(), { timeout: 10_000 }).toBe(true);
    expect(await a.isLeader()).toBe(false);
    await b.release();
    expect(await a.isLeader()).toBe(true);
    await a.release();
  });

  it('only the leader’s clock ticks', async () => {
    const name = `test-clock-${RUN_ID}`;
    const asked: string[] = [];
    const clockOf = (db: DataSource, who: string, leader: Leadership) => createForecastScheduler(db, () => undefined, {
      leader,
      recompute: async () => {
        asked.push(who);
        return { status: 'unmoved' };
      },
    });
    const first = clockOf(one, 'first', namedLockLeader(one, name));
    const second = clockOf(two, 'second', namedLockLeader(two, name));
    first.startClock(100);
    await expect.poll(() => asked.includes('first'), { timeout: 10_000 }).toBe(true);
    second.startClock(100);
    await first.flush();
    const seen = asked.length;
    await expect.poll(() => asked.length, { timeout: 10_000 }).toBeGreaterThan(seen + 2);
    expect(asked.includes('second')).toBe(false);
    // The first stops (a process shutting down releases the lock): the second's clock takes over.
    first.stop();
    await expect.poll(() => asked.includes('second'), { timeout: 10_000 }).toBe(true);
    second.stop();
    await Promise.all([first.flush(), second.flush()]);
  });
});
