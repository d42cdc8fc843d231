import { describe, expect, it } from 'vitest';
import { instantToLocal, isTimeZone, localDate, localToInstant, minutesBetween, offsetAt } from './index';

describe('wall-clock times read in the airport zone', () => {
  it('reads a New York time in winter and in summer', () => {
    // US Eastern time is UTC-5 in standard time and UTC-4 in daylight time, from the second Sunday of March to the
    // first Sunday of November (15 U.S.C. 260a).
    expect(localToInstant('arrival', '2026-12-01T21:05', 'America/New_York')).toBe('2026-12-02T02:05:00.000Z');
    expect(localToInstant('arrival', '2026-07-01T21:05', 'America/New_York')).toBe('2026-07-02T01:05:00.000Z');
  });

  it('reads the same typed text as different instants in different airports', () => {
    // Tokyo keeps UTC+9 all year (no summer time since 1951, from memory); Rome is UTC+1 in December (Directive 2000/84/EC).
    expect(localToInstant('arrival', '2026-12-01T09:00', 'Asia/Tokyo')).toBe('2026-12-01T00:00:00.000Z');
    expect(localToInstant('arrival', '2026-12-01T09:00', 'Europe/Rome')).toBe('2026-12-01T08:00:00.000Z');
  });

  it('handles Rome across the change to summer time, refusing the hour that does not exist', () => {
    // EU summer time starts at 01:00 UTC on the last Sunday of March (Directive 2000/84/EC, Art. 2): 29 March 2026,
    // when Rome's clocks go from 02:00 to 03:00.
    expect(localToInstant('departure', '2026-03-29T00:30', 'Europe/Rome')).toBe('2026-03-28T23:30:00.000Z');
    expect(localToInstant('departure', '2026-03-29T04:00', 'Europe/Rome')).toBe('2026-03-29T02:00:00.000Z');
    expect(() => localToInstant('departure', '2026-03-29T02:30', 'Europe/Rome')).toThrow(/departure: 2026-03-29T02:30 does not exist in Europe\/Rome/);
  });

  it('reads the repeated autumn hour as the first of the two', () => {
    // EU summer time ends at 01:00 UTC on the last Sunday of October (Directive 2000/84/EC, Art. 3): 25 October 2026;
    // 02:30 happens at 00:30 UTC (CEST) and again at 01:30 UTC (CET). Derived.
    expect(localToInstant('departure', '2026-10-25T02:30', 'Europe/Rome')).toBe('2026-10-25T00:30:00.000Z');
  });

  it('refuses text that is not a date and time, a date that is not on the calendar and an unknown zone', () => {
    expect(() => localToInstant('arrival', '', 'America/New_York')).toThrow(/arrival: expected a local date and time/);
    expect(() => localToInstant('arrival', '21:05', 'America/New_York')).toThrow(/arrival: expected/);
    expect(() => localToInstant('arrival', '2026-02-30T10:00', 'America/New_York')).toThrow(/not a calendar date/);
    expect(() => localToInstant('arrival', '2026-02-01T10:00', 'Mars/Olympus')).toThrow(/arrival time zone: expected an IANA time zone/);
    expect(isTimeZone('Europe/Rome')).toBe(true);
    expect(isTimeZone('EST5EDT-nonsense')).toBe(false);
  });

  it('reads an instant back as the airport clock, its date and its offset', () => {
    expect(instantToLocal('2026-12-02T02:05:00.000Z', 'America/New_York')).toBe('2026-12-01T21:05');
    expect(instantToLocal(new Date('2026-12-02T02:05:00.000Z'), 'America/Toronto')).toBe('2026-12-01T21:05');
    expect(localDate('2026-12-02T02:05:00.000Z', 'America/New_York')).toBe('2026-12-01');
    expect(localDate('2026-12-02T02:05:00.000Z', 'Europe/Rome')).toBe('2026-12-02');
    expect(offsetAt('2026-07-01T12:00:00Z', 'America/New_York')).toBe('-04:00');
    expect(minutesBetween('2026-12-01T10:00:00Z', '2026-12-01T08:30:00-03:00')).toBe(90);
  });
});
