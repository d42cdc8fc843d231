import { describe, expect, it } from 'vitest';
import { percentScaleTop } from './scale';

// Derived by hand from the rule: 1.2 × the larger of peak and target, rounded up to 2, 10 or 25 points.
describe('percentScaleTop', () => {
  it('keeps a 5 % target and 3 % odds on a 0-6 % scale', () => expect(percentScaleTop(3, 5)).toBe(6));
  it('rounds to tens in the middle range', () => expect(percentScaleTop(30, 5)).toBe(40));
  it('rounds to quarters near the top and never passes 100 %', () => {
    expect(percentScaleTop(60, 5)).toBe(75);
    expect(percentScaleTop(99, 5)).toBe(100);
  });
  it('still has a scale when everything is zero', () => expect(percentScaleTop(0, 0)).toBe(2));
});
