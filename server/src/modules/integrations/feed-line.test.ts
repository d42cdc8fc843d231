// The feed's group commit with the batch writer replaced: POSTs that arrive while a batch is written go together in
// the next one, each POST gets its own results, and a batch that fails is written again POST by POST.
import type { DataSource } from 'typeorm';
import { beforeEach, describe, expect, it, vi } from 'vitest';

const batches: unknown[][] = [];
let release: (() => void) | null = null;
vi.mock('./events.service', () => ({
  applyEventBatch: vi.fn(async (_db: unknown, _station: number, events: { id: string; flight: number }[]) => {
    batches.push(events.map((e) => e.id));
    if (batches.length === 1) await new Promise<void>((r) => (release = r));
    if (events.length > 1 && events.some((e) => e.id === 'poison')) throw new Error('a fault no check foresaw');
    if (events.length === 1 && events[0].id === 'poison') throw new Error('a fault no check foresaw');
    return {
      results: events.map((e, index) => ({ index, id: e.id, status: 'applied', message: `applied ${e.id}` })),
    };
  }),
}));

const { applyFeedEvents } = await import('./feed-line');
const turn = () => new Promise<void>((r) => setImmediate(r));

beforeEach(() => {
  batches.length = 0;
  release = null;
});

describe('the feed line of a station', () => {
  it('writes a lone POST at once, and the POSTs that arrive meanwhile together in one batch, each with its own answer', async () => {
    const db = {} as DataSource;
    const first = applyFeedEvents(db, 1, [{ id: 'a', flight: 10 }]);
    await turn();
    const second = applyFeedEvents(db, 1, [{ id: 'b', flight: 10 }, { id: 'c', flight: 11 }]);
    const third = applyFeedEvents(db, 1, [{ id: 'd', flight: 12 }]);
    // Another station is not held up by this one's batch.
    const elsewhere = applyFeedEvents(db, 2, [{ id: 'x', flight: 20 }]);
    await turn();
    expect(batches).toEqual([['a'], ['x']]);
    release!();
    const answers = await Promise.all([first, second, third, elsewhere]);
    expect(batches).toEqual([['a'], ['x'], ['b', 'c', 'd']]);
    expect(answers[1].results).toEqual([
      { index: 0, id: 'b', status: 'applied', message: 'applied b' },
      { index: 1, id: 'c', status: 'applied', message: 'applied c' },
    ]);
    expect(answers[2].results).toEqual([{ index: 0, id: 'd', status: 'applied', message: 'applied d' }]);
  });

  it('writes a failed batch again POST by POST: only the POST that fails alone gets the failure', async () => {
    const db = {} as DataSource;
    const first = applyFeedEvents(db, 3, [{ id: 'a', flight: 10 }]);
    await turn();
    const good = applyFeedEvents(db, 3, [{ id: 'b', flight: 10 }]);
    const bad = applyFeedEvents(db, 3, [{ id: 'poison', flight: 10 }]);
    const good2 = applyFeedEvents(db, 3, [{ id: 'c', flight: 10 }]);
    release!();
    await expect(bad).rejects.toThrow('a fault no check foresaw');
    expect((await good).results[0]).toMatchObject({ id: 'b', status: 'applied' });
    expect((await good2).results[0]).toMatchObject({ id: 'c', status: 'applied' });
    await first;
    expect(batches).toEqual([['a'], ['b', 'poison', 'c'], ['b'], ['poison'], ['c']]);
  });
});
