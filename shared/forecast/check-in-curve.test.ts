import { describe, expect, it } from 'vitest';
import { CHECK_IN_GRID, learnCheckInCurve } from './check-in-curve';

describe('learnCheckInCurve', () => {
  it('gives one station its own shares, never falling toward departure', () => {
    // One station alone has nothing to shrink toward but itself: shares are counts over shows; the dip at 180
    // minutes (48 after 50) is raised to 50.
    const curves = learnCheckInCurve([{ segment: ['LHR'], showed: 100, checkedInBy: [0, 30, 50, 48, 70, 90, 97, 100] }]);
    expect(curves.get('LHR')).toEqual(CHECK_IN_GRID.map((m, k) => [m, [0, 0.3, 0.5, 0.5, 0.7, 0.9, 0.97, 1][k]]));
  });

  it('pulls a thin route toward its station', () => {
    const curves = learnCheckInCurve(
      [
        { segment: ['LHR', 'JFK'], showed: 2000, checkedInBy: [0, 600, 1000, 1100, 1400, 1800, 1950, 2000] },
        { segment: ['LHR', 'ORD'], showed: 10, checkedInBy: [0, 0, 0, 0, 0, 0, 0, 10] },
      ],
      CHECK_IN_GRID,
      { minEvidence: 30 },
    );
    expect(curves.get('LHR/ORD')).toEqual(curves.get('LHR'));
  });

  it('refuses counts that do not match the grid', () => {
    expect(() => learnCheckInCurve([{ segment: ['LHR'], showed: 1, checkedInBy: [1] }])).toThrow(/checkedInBy/);
  });
});
