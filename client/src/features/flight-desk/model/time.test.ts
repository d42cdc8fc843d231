import { describe, expect, it } from 'vitest';
import { connectionMinutes, describeCountdown, formatClock } from './time';

const DEP = '2026-03-10T18:35:00Z';
const at = (iso: string) => new Date(iso).getTime();

describe('describeCountdown', () => {
  // Derived by hand: 18:35 minus 16:55 is 1 h 40 min.
  it('says hours and minutes before departure', () => expect(describeCountdown(DEP, at('2026-03-10T16:55:00Z'))).toBe('in 1 h 40 min'));
  it('drops the minutes on a whole hour', () => expect(describeCountdown(DEP, at('2026-03-10T17:35:00Z'))).toBe('in 1 h'));
  it('rounds down so it never promises more time than there is', () => expect(describeCountdown(DEP, at('2026-03-10T18:29:30Z'))).toBe('in 5 min'));
  it('says now within the last minute either side', () => {
    expect(describeCountdown(DEP, at('2026-03-10T18:34:30Z'))).toBe('now');
    expect(describeCountdown(DEP, at('2026-03-10T18:35:40Z'))).toBe('now');
  });
  it('counts up after departure', () => expect(describeCountdown(DEP, at('2026-03-10T18:47:10Z'))).toBe('12 min ago'));
});

describe('formatClock', () => {
  // 18:35:07 UTC is 14:35:07 in New York on 10 March 2026: EDT (UTC-4) began on 8 March 2026, the second Sunday of
  // March (US daylight saving rule, 15 U.S.C. 260a).
  it('shows the station clock with seconds', () => expect(formatClock('2026-03-10T18:35:07Z', 'America/New_York')).toBe('14:35:07'));
  // Rome is UTC+1 in March before the last Sunday (EU summer-time rule, Directive 2000/84/EC).
  it('uses the zone it is given, not the browser’s', () => expect(formatClock(at('2026-03-10T18:35:07Z'), 'Europe/Rome')).toBe('19:35:07'));
});

describe('connectionMinutes', () => {
  it('is the time from landing to our departure', () => expect(connectionMinutes('2026-03-10T17:50:00Z', DEP)).toBe(45));
  it('is negative when the inbound lands after we leave', () => expect(connectionMinutes('2026-03-10T18:45:00Z', DEP)).toBe(-10));
});
