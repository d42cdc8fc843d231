import { describe, expect, it } from 'vitest';
import { showProbabilityNotCheckedIn } from './check-in';

describe('showProbabilityNotCheckedIn = q(1-G)/(1-qG) (Bayes update; derived)', () => {
  it('is q before anyone checks in and 0 once every show-up has', () => {
    expect(showProbabilityNotCheckedIn(0.87, 0)).toBe(0.87);
    expect(showProbabilityNotCheckedIn(0.87, 1)).toBe(0);
    expect(showProbabilityNotCheckedIn(1, 1)).toBe(0);
  });

  it('gives 9/11 for q = 0.9, G = 0.5 (0.45 / 0.55; derived)', () => {
    expect(showProbabilityNotCheckedIn(0.9, 0.5)).toBeCloseTo(9 / 11, 15);
  });

  it('agrees with counting a population of 1000 bookings (derived)', () => {
    // q = 0.8: 800 will show; G = 0.75 of them (600) have checked in; 400 have not, of whom 200 will show
    expect(showProbabilityNotCheckedIn(0.8, 0.75)).toBeCloseTo(200 / 400, 15);
  });

  it('falls as check-in goes on and keeps q = 0 and q = 1 fixed before G = 1', () => {
    let previous = 1;
    for (const g of [0, 0.2, 0.5, 0.8, 0.95, 0.999]) {
      const value = showProbabilityNotCheckedIn(0.92, g);
      expect(value).toBeLessThan(previous);
      previous = value;
    }
    expect(showProbabilityNotCheckedIn(0, 0.4)).toBe(0);
    expect(showProbabilityNotCheckedIn(1, 0.4)).toBe(1);
  });

  it('rejects values outside [0, 1] naming the field', () => {
    expect(() => showProbabilityNotCheckedIn(1.1, 0.2)).toThrow(/^q must be within \[0, 1\]/);
    expect(() => showProbabilityNotCheckedIn(0.5, Number.NaN)).toThrow(/^checkedInShare must be within \[0, 1\]/);
  });
});
