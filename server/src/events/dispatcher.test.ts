import { describe, expect, it } from 'vitest';
import { createEventDispatcher } from './dispatcher';
import { flightChanged, mailQueued, stationChanged } from './domain-events';

describe('the domain event dispatcher', () => {
  it('hands each event to the subscribers of its type, in the order given', () => {
    const d = createEventDispatcher();
    const seen: string[] = [];
    d.subscribe('flight-changed', (e) => void seen.push(`flight ${e.flightId} ${e.topics.join('+')}`));
    d.subscribe('mail-queued', () => void seen.push('mail'));
    d.subscribe('station-changed', (e) => void seen.push(`station ${e.stationId}`));
    d.dispatch([flightChanged(1, 9, ['rounds']), mailQueued(), flightChanged(2, 9, ['counts']), stationChanged(9, ['alerts'])]);
    expect(seen).toEqual(['flight 1 rounds', 'mail', 'flight 2 counts', 'station 9']);
  });

  it('keeps going past a subscriber that throws or rejects, and logs it', async () => {
    const lines: string[] = [];
    const d = createEventDispatcher((line) => lines.push(line));
    const seen: number[] = [];
    d.subscribe('flight-changed', () => {
      throw new Error('socket gone');
    });
    d.subscribe('flight-changed', async () => {
      throw new Error('queue gone');
    });
    d.subscribe('flight-changed', (e) => void seen.push(e.flightId));
    expect(() => d.dispatch([flightChanged(1, 9, ['rounds']), flightChanged(2, 9, ['rounds'])])).not.toThrow();
    expect(seen).toEqual([1, 2]);
    await expect.poll(() => lines.length).toBe(4);
    expect(lines[0]).toContain('flight-changed');
    expect(lines.join('\n')).toContain('socket gone');
    expect(lines.join('\n')).toContain('queue gone');
  });

  it('stops calling a subscriber once it unsubscribes', () => {
    const d = createEventDispatcher();
    let calls = 0;
    const off = d.subscribe('mail-queued', () => void calls++);
    d.dispatch([mailQueued()]);
    off();
    d.dispatch([mailQueued()]);
    expect(calls).toBe(1);
  });
});
