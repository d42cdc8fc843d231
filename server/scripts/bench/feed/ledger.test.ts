import { describe, expect, it } from 'vitest';
import { Ledger } from './ledger';
import { percentile } from './stats';

describe('percentile (nearest rank)', () => {
  // Worked example of the nearest-rank method in Wikipedia's "Percentile" article (list 15, 20, 35, 40, 50), from memory.
  const list = [50, 15, 40, 20, 35];
  it.each([
    [5, 15],
    [30, 20],
    [40, 20],
    [50, 35],
    [100, 50],
  ])('P%i is %i', (p, expected) => expect(percentile(list, p)).toBe(expected));

  it('is NaN for no samples', () => expect(percentile([], 99)).toBeNaN());
});

describe('Ledger: which events an update covers', () => {
  /** computed_at values handed out in order, as the server's recomputes would stamp them. */
  const stamps = (...values: number[]) => {
    const queue = [...values];
    return async () => queue.shift() ?? null;
  };

  it('gives an update the events answered by its recompute start, and the rest to the next update', async () => {
    const ledger = new Ledger([1], stamps(25, 100));
    ledger.sent(1, 0)(true, 10); // answered before the first recompute started (25): covered by update 0
    ledger.sent(1, 20)(true, 30); // answered after it: waits for update 1
    ledger.received(0, 1, 40);
    ledger.received(1, 1, 42);
    await ledger.settle();
    ledger.received(0, 1, 120);
    ledger.received(1, 1, 121);
    await ledger.settle();
    const f = ledger.figures();
    // Derived: deliveries 40 - 0, 42 - 0, 120 - 20, 121 - 20 = 40, 42, 100, 101.
    expect(f.deliveries).toEqual({ count: 4, p50: 42, p99: 101, max: 101 });
    expect(f.firstConsole).toEqual({ p50: 40, p99: 100 });
    expect(f.lastConsole).toEqual({ p50: 42, p99: 101 });
    // Derived: waits 25 - 10 and 100 - 30; recompute to first console 40 - 25 and 120 - 100.
    expect(f.answerToRecompute).toEqual({ p50: 15, p99: 70 });
    expect(f.recomputeToConsole).toEqual({ p50: 15, p99: 20 });
    expect(f).toMatchObject({ eventsCovered: 2, eventsNeverCovered: 0, updates: 2, races: 0 });
    expect(f.messagesPerConsole).toEqual({ fewest: 2, most: 2, flightsWithGaps: 0 });
  });

  it('counts an event as never covered when no update took it, and a rejected one not at all', async () => {
    const ledger = new Ledger([1], stamps(5));
    ledger.sent(1, 0)(true, 10);
    ledger.sent(1, 1)(false, 2);
    const open = ledger.sent(1, 3);
    ledger.received(0, 1, 20);
    await ledger.settle();
    expect(ledger.uncovered()).toBe(2); // one answered after the recompute started, one still in flight
    open(true, 30);
    expect(ledger.figures()).toMatchObject({ eventsCovered: 0, eventsNeverCovered: 2 });
  });

  it('flags a read that returned the same recompute as the read before it', async () => {
    const ledger = new Ledger([1], stamps(50, 50));
    ledger.sent(1, 0)(true, 10);
    ledger.received(0, 1, 60);
    ledger.received(0, 1, 61);
    await ledger.settle();
    expect(ledger.figures().races).toBe(1);
  });

  it('shows a console that missed a message as a gap', async () => {
    const ledger = new Ledger([1], stamps(5, 6));
    ledger.received(0, 1, 10);
    ledger.received(1, 1, 10);
    ledger.received(0, 1, 20);
    await ledger.settle();
    expect(ledger.figures().messagesPerConsole).toEqual({ fewest: 1, most: 2, flightsWithGaps: 1 });
  });

  it('refuses to forget while events are in flight', () => {
    const ledger = new Ledger([1], stamps());
    ledger.sent(1, 0);
    expect(() => ledger.reset()).toThrow(/in flight/);
  });
});
