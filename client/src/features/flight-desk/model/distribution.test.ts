import { describe, expect, it } from 'vitest';
import { mostLikelyShows, showsBars } from './distribution';

describe('showsBars', () => {
  it('marks every bar above the capacity as over, and none at or below it', () => {
    const pmf = [0, 0, 0.1, 0.2, 0.4, 0.2, 0.1];
    const bars = showsBars(pmf, 4);
    expect(bars.filter((b) => b.over).map((b) => b.shows)).toEqual([5, 6]);
    expect(bars.find((b) => b.shows === 4)?.over).toBe(false);
  });

  it('leaves out invisible tails but keeps the capacity and one bar past it in view', () => {
    // Derived: mass only on 2..4, capacity 8, so the window must stretch to 7..9 around the seat line.
    const pmf = [0, 0, 0.3, 0.4, 0.3, 0, 0, 0, 0, 0, 0, 0];
    const bars = showsBars(pmf, 8);
    expect(bars[0].shows).toBe(2);
    expect(bars[bars.length - 1].shows).toBe(9);
  });

  it('trims a long invisible left tail', () => {
    const pmf = [...Array(100).fill(0), 0.25, 0.5, 0.25];
    const bars = showsBars(pmf, 101);
    expect(bars.map((b) => b.shows)).toEqual([100, 101, 102]);
  });

  it('keeps the probabilities as given', () => {
    const pmf = [0.5, 0.5];
    expect(showsBars(pmf, 0).map((b) => b.p)).toEqual([0.5, 0.5]);
  });

  it('draws nothing for an empty distribution', () => expect(showsBars([], 10)).toEqual([]));
});

describe('mostLikelyShows', () => {
  it('is the mode of the pmf', () => expect(mostLikelyShows([0.1, 0.2, 0.5, 0.2])).toBe(2));
});
