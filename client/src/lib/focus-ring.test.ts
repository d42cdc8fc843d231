import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { contrastRatio } from './contrast';

// The palette as the browser gets it: read from the stylesheet, so a change of colour there is measured here.
const css = readFileSync(resolve(__dirname, '../styles.css'), 'utf8');
const colour = (name: string) => {
  const m = new RegExp(`--color-${name}:\\s*(#[0-9a-fA-F]{6})`).exec(css);
  if (!m) throw new Error(`--color-${name} is not in styles.css`);
  return m[1]!;
};

// WCAG 2.2 SC 1.4.11 (non-text contrast) and 2.4.13 (focus appearance): 3:1 against adjacent colours.
const MIN = 3;

describe('focus ring contrast', () => {
  it('checks the formula on the WCAG extremes (black on white is 21:1, a colour on itself 1:1)', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 5);
    expect(contrastRatio('#123c4a', '#123c4a')).toBeCloseTo(1, 5);
    // The signal yellow on white measures about 1.4:1 (computed with the WCAG formula): too faint for a ring.
    expect(contrastRatio('#f4d35e', '#ffffff')).toBeLessThan(MIN);
  });

  it.each(['card', 'paper', 'signal', 'harbour-soft', 'calm-soft', 'watch-soft', 'alert-soft', 'line'])(
    'the ring on light surfaces stands out against %s by 3:1 or more',
    (surface) => {
      expect(contrastRatio(colour('focus'), colour(surface))).toBeGreaterThanOrEqual(MIN);
    },
  );

  it('the ring on the harbour-blue bar stands out against it by 3:1 or more', () => {
    expect(contrastRatio(colour('focus-on-dark'), colour('harbour'))).toBeGreaterThanOrEqual(MIN);
  });

  it('the stylesheet draws the ring in those colours', () => {
    expect(css).toMatch(/:focus-visible\s*\{\s*outline:\s*3px solid var\(--color-focus\)/);
    expect(css).toMatch(/\.on-dark :focus-visible\s*\{\s*outline-color:\s*var\(--color-focus-on-dark\)/);
  });
});
