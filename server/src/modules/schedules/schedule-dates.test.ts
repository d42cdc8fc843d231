import { describe, expect, it } from 'vitest';
import { isoWeekday, scheduleDates } from './schedule-dates';

describe('schedule dates', () => {
  // Check values from any printed calendar: 1 December 2026 is a Tuesday, 6 December 2026 a Sunday, 29 February 2028 a Tuesday.
  it('numbers weekdays as ISO 8601 does, Monday 1 to Sunday 7', () => {
    expect(isoWeekday('2026-12-01')).toBe(2);
    expect(isoWeekday('2026-12-06')).toBe(7);
    expect(isoWeekday('2028-02-29')).toBe(2);
  });

  it('lists the chosen weekdays in the range, both ends included, across a month end and a leap day', () => {
    expect(scheduleDates('2026-11-30', '2026-12-13', [1, 5])).toEqual(['2026-11-30', '2026-12-04', '2026-12-07', '2026-12-11']);
    expect(scheduleDates('2028-02-28', '2028-03-01', [1, 2, 3, 4, 5, 6, 7])).toEqual(['2028-02-28', '2028-02-29', '2028-03-01']);
    expect(scheduleDates('2026-12-01', '2026-12-01', [3])).toEqual([]);
  });

  it('keeps the same dates across a clock change (the pattern is in calendar days, not hours)', () => {
    // 29 March 2026: Europe moves its clocks forward (EU Directive 2000/84/EC, last Sunday of March).
    expect(scheduleDates('2026-03-28', '2026-03-30', [6, 7, 1])).toEqual(['2026-03-28', '2026-03-29', '2026-03-30']);
  });
});
