// The scheduler with a recompute of the test's own: each call waits until the test lets it finish, so overlaps,
// coalescing and ordering can be checked step by step.
import fc from 'fast-check';
import type { DataSource } from 'typeorm';
import { describe, expect, it } from 'vitest';
import { createForecastScheduler, type Recompute } from './forecast-scheduler';
import type { RecomputeOutcome, RecomputeResult } from './forecast.service';
import { memoryRecomputeQueue } from './recompute-queue-memory';

const noDb = {} as DataSource;
// Asks are written to the queue a turn after they are made, and claims and finishes are awaited: a few turns let
// every step that can run, run.
const turn = async () => {
  for (let i = 0; i < 6; i++) await new Promise<void>((r) => setImmediate(r));
};

function harness(result: (flightId: number, call: number) => RecomputeResult['status'] = () => 'written') {
  const calls: { flightId: number; onlyIfMoved: boolean; startedAt: number; finish: () => void }[] = [];
  const running = new Map<number, number>();
  let step = 0;
  let overlap = false;
  const recompute: Recompute = (flightId, opts) => new Promise((resolve) => {
    running.set(flightId, (running.get(flightId) ?? 0) + 1);
    if (running.get(flightId)! > 1) overlap = true;
    const n = calls.filter((c) => c.flightId === flightId).length;
    calls.push({
      flightId, onlyIfMoved: opts.onlyIfMoved, startedAt: step,
      finish: () => {
        running.set(flightId, running.get(flightId)! - 1);
        const status = result(flightId, n);
        const outcome = { flightId, stationId: 1, pOversale: 0, version: n + 1, notice: {} } as RecomputeOutcome;
        resolve(status === 'written' ? { status, outcome } : ({ status } as RecomputeResult));
      },
    });
  });
  const told: number[] = [];
  const scheduler = createForecastScheduler(noDb, (o) => told.push(o.flightId), { recompute, parallel: 2, queue: memoryRecomputeQueue() });
  const unfinished = () => calls.filter((c) => !(c as { done?: boolean }).done);
  const finishOldest = async () => {
    const c = unfinished()[0];
    if (!c) return false;
    (c as { done?: boolean }).done = true;
    c.finish();
    await turn();
    await turn();
    return true;
  };
  return { scheduler, calls, told, finishOldest, overlap: () => overlap, tick: () => step++ };
}

describe('forecast scheduler', () => {
  it('starts a recompute at once when idle', async () => {
    const h = harness();
    h.scheduler.markDirty(7);
    await turn();
    expect(h.calls.map((c) => c.flightId)).toEqual([7]);
  });

  it('takes a burst of changes during a recompute together in one more recompute (the latest state wins)', async () => {
    const h = harness();
    h.scheduler.markDirty(7);
    await turn();
    for (let i = 0; i < 50; i++) h.scheduler.markDirty(7);
    await turn();
    expect(h.calls).toHaveLength(1); // never two at once for one flight
    await h.finishOldest();
    expect(h.calls).toHaveLength(2);
    await h.finishOldest();
    expect(h.calls).toHaveLength(2);
    expect(h.told).toEqual([7, 7]);
  });

  it('runs a stale recompute once more, and tells nobody about it', async () => {
    const h = harness((_id, call) => (call === 0 ? 'stale' : 'written'));
    h.scheduler.markDirty(3);
    await turn();
    await h.finishOldest();
    expect(h.calls).toHaveLength(2);
    expect(h.told).toEqual([]);
    await h.finishOldest();
    expect(h.told).toEqual([3]);
  });

  it('runs flights side by side up to its parallel limit', async () => {
    const h = harness();
    [1, 2, 3].forEach((id) => h.scheduler.markDirty(id));
    await turn();
    expect(h.calls.map((c) => c.flightId)).toEqual([1, 2]);
    await h.finishOldest();
    expect(h.calls.map((c) => c.flightId)).toEqual([1, 2, 3]);
  });

  it('puts a flight asked for again behind the flights waiting longer: a busy flight never starves the others', async () => {
    const h = harness();
    [1, 2, 3].forEach((id) => h.scheduler.markDirty(id));
    await turn();
    expect(h.calls.map((c) => c.flightId)).toEqual([1, 2]);
    // Flights 1 and 2 get check-ins all the time; flight 3 has waited since the start.
    h.scheduler.markDirty(1);
    h.scheduler.markDirty(2);
    await turn();
    await h.finishOldest();
    expect(h.calls.map((c) => c.flightId)).toEqual([1, 2, 3]);
    h.scheduler.markDirty(2);
    await turn();
    await h.finishOldest();
    // Flight 2's ask came after flight 1's: flight 1 goes first.
    expect(h.calls.map((c) => c.flightId)).toEqual([1, 2, 3, 1]);
  });

  it('does not ask the queue again when a recompute ends and the line was already empty', async () => {
    const queue = memoryRecomputeQueue();
    let claims = 0;
    const counted = { ...queue, claim: (limit: number) => ((claims += 1), queue.claim(limit)) };
    let finish: (() => void) | null = null;
    const recompute: Recompute = () => new Promise((resolve) => (finish = () => resolve({ status: 'unmoved' })));
    const scheduler = createForecastScheduler(noDb, () => undefined, { recompute, parallel: 2, queue: counted });
    scheduler.markDirty(5);
    await turn();
    expect(claims).toBe(1); // it found one flight where it had room for two: the line is empty
    finish!();
    await scheduler.flush();
    expect(claims).toBe(1);
    // A new ask is a sign of work: claimed at once.
    scheduler.markDirty(6);
    await turn();
    expect(claims).toBe(2);
    finish!();
    await scheduler.flush();
  });

  it('whatever the order of changes and completions: never two at once for a flight, and every change is followed by a recompute that started after it', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.oneof(fc.integer({ min: 1, max: 3 }), fc.constant(0)), { maxLength: 40 }), async (ops) => {
        const h = harness();
        const marks: { flightId: number; at: number }[] = [];
        for (const op of ops) {
          const at = h.tick();
          if (op === 0) await h.finishOldest();
          else {
            marks.push({ flightId: op, at });
            h.scheduler.markDirty(op);
            await turn();
          }
        }
        h.tick();
        while (await h.finishOldest());
        expect(h.overlap()).toBe(false);
        for (const m of marks) expect(h.calls.some((c) => c.flightId === m.flightId && c.startedAt > m.at)).toBe(true);
      }),
      { numRuns: 150 },
    );
  });
});
