import { describe, expect, it } from 'vitest';
import { COMPENSATION_STATES } from '@shared/schemas/finance';
import { STATE_LOOK } from './words';

describe('compensation words', () => {
  it('says every state in words with an icon (never colour alone: WCAG 2.2 SC 1.4.1 Use of Color)', () => {
    for (const s of COMPENSATION_STATES) {
      expect(STATE_LOOK[s].text.length).toBeGreaterThan(0);
      expect(STATE_LOOK[s].icon.length).toBeGreaterThan(0);
    }
  });
});
