import { describe, expect, it } from 'vitest';
import { quarterRange } from './quarter';

// Quarter ends from 14 CFR 250.10(a): "The calendar quarters end March 31, June 30, September 30 and December 31."
describe('quarterRange', () => {
  it('spans each calendar quarter', () => {
    expect(quarterRange('2026-Q1')).toEqual({ from: '2026-01-01', to: '2026-03-31' });
    expect(quarterRange('2026-Q2')).toEqual({ from: '2026-04-01', to: '2026-06-30' });
    expect(quarterRange('2026-Q3')).toEqual({ from: '2026-07-01', to: '2026-09-30' });
    expect(quarterRange('2026-Q4')).toEqual({ from: '2026-10-01', to: '2026-12-31' });
  });

  it('refuses anything else, naming the field', () => {
    expect(() => quarterRange('2026-Q5')).toThrow(/^quarter:/);
  });
});
