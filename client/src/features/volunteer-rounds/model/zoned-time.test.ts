import { describe, expect, it } from 'vitest';
import { isoToZoned, zonedToIso } from './zoned-time';

describe('station wall-clock times', () => {
  it('turns a New York time into UTC in winter and in summer', () => {
    // US Eastern time is UTC-5 in standard time and UTC-4 in daylight time, which runs from the second Sunday of
    // March to the first Sunday of November (15 U.S.C. 260a).
    expect(zonedToIso('2026-12-01T21:05', 'America/New_York')).toBe('2026-12-02T02:05:00.000Z');
    expect(zonedToIso('2026-07-01T21:05', 'America/New_York')).toBe('2026-07-02T01:05:00.000Z');
  });

  it('handles Rome across the change to summer time', () => {
    // EU summer time starts at 01:00 UTC on the last Sunday of March (Directive 2000/84/EC): 29 March 2026.
    // Derived: 00:30 local is still CET (UTC+1); 04:00 local is CEST (UTC+2).
    expect(zonedToIso('2026-03-29T00:30', 'Europe/Rome')).toBe('2026-03-28T23:30:00.000Z');
    expect(zonedToIso('2026-03-29T04:00', 'Europe/Rome')).toBe('2026-03-29T02:00:00.000Z');
  });

  it('refuses text that is not a date and time, and reads an instant back as the station’s clock', () => {
    expect(zonedToIso('', 'America/New_York')).toBeNull();
    expect(zonedToIso('21:05', 'America/New_York')).toBeNull();
    expect(isoToZoned('2026-12-02T02:05:00.000Z', 'America/New_York')).toBe('2026-12-01T21:05');
    expect(isoToZoned('2026-12-02T02:05:00.000Z', 'America/Toronto')).toBe('2026-12-01T21:05');
  });
});
