// Which segment a passenger is read from, worked by hand on one flight leaving at 12:00 with check-in closing 30 min out.
import { describe, expect, it } from 'vitest';
import { liveSegment, trainingSegments } from './check-in-segments';

const DEPARTURE = new Date('2026-12-03T12:00:00Z');
const at = (hhmm: string, day = '03') => new Date(`2026-12-${day}T${hhmm}:00Z`);
const minutesBefore = (now: Date) => (DEPARTURE.getTime() - now.getTime()) / 60_000;
const live = (now: Date, checkedInAt: Date | null) => liveSegment(minutesBefore(now), 30, checkedInAt, DEPARTURE);

describe('the segment of a closed flight’s booking, per horizon', () => {
  it('reads the state at T−24 h, T−3 h, T−1 h and at departure', () => {
    // Checked in at 09:30, 2 h 30 min out: not yet at T−24 h (12:00 the day before) nor T−3 h (09:00), yes at T−1 h (11:00).
    expect(trainingSegments(at('09:30'), DEPARTURE)).toEqual([
      { horizon: 'booked', state: 'any' },
      { horizon: 'T-24h', state: 'not-checked-in' },
      { horizon: 'T-3h', state: 'not-checked-in' },
      { horizon: 'T-1h', state: 'checked-in' },
      { horizon: 'closed', state: 'checked-in' },
    ]);
    // Exactly at the window counts as checked in by it.
    expect(trainingSegments(at('09:00'), DEPARTURE)[2]).toEqual({ horizon: 'T-3h', state: 'checked-in' });
    expect(trainingSegments(null, DEPARTURE).slice(1).every((s) => s.state === 'not-checked-in')).toBe(true);
  });
});

describe('the segment a passenger is read from now', () => {
  it('before T−24 h knows nothing about check-in', () => {
    expect(live(at('08:00', '02'), null)).toEqual({ horizon: 'booked', state: 'any' });
    // Checked in already (28 h out): sure to be checked in at T−24 h.
    expect(live(at('09:00', '02'), at('08:00', '02'))).toEqual({ horizon: 'T-24h', state: 'checked-in' });
  });

  it('between windows reads the latest window reached', () => {
    // 07:00 is 5 h out: T−24 h reached, T−3 h not.
    expect(live(at('07:00'), null)).toEqual({ horizon: 'T-24h', state: 'not-checked-in' });
    expect(live(at('07:00'), at('10:00', '02'))).toEqual({ horizon: 'T-24h', state: 'checked-in' });
    // Checked in at 06:00, after T−24 h: not in the T−24 h checked-in segment, but sure to be checked in at T−3 h.
    expect(live(at('07:00'), at('06:00'))).toEqual({ horizon: 'T-3h', state: 'checked-in' });
    // 10:00 is 2 h out: T−3 h reached.
    expect(live(at('10:00'), null)).toEqual({ horizon: 'T-3h', state: 'not-checked-in' });
    expect(live(at('10:00'), at('08:59'))).toEqual({ horizon: 'T-3h', state: 'checked-in' });
    expect(live(at('10:00'), at('09:30'))).toEqual({ horizon: 'T-1h', state: 'checked-in' });
  });

  it('after T−1 h and once check-in has closed', () => {
    // 11:15 is 45 min out: T−1 h reached, check-in still open.
    expect(live(at('11:15'), null)).toEqual({ horizon: 'T-1h', state: 'not-checked-in' });
    expect(live(at('11:15'), at('11:10'))).toEqual({ horizon: 'closed', state: 'checked-in' });
    expect(live(at('11:15'), at('10:00'))).toEqual({ horizon: 'T-1h', state: 'checked-in' });
    // 11:40 is 20 min out: closed; not checked in now means never.
    expect(live(at('11:40'), null)).toEqual({ horizon: 'closed', state: 'not-checked-in' });
  });
});
