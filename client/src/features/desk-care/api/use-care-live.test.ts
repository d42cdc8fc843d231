import { describe, expect, it } from 'vitest';
import { careNoticeRefetches } from './use-care-live';

describe('careNoticeRefetches', () => {
  it('a choice or care recorded elsewhere, a new case or a payment step refetches the care panel', () => {
    for (const topics of [['care'], ['care', 'notices'], ['denials', 'compensations', 'notices'], ['rounds'], ['compensations']]) {
      expect(careNoticeRefetches({ id: 1, topics }), topics.join()).toBe(true);
    }
    expect(careNoticeRefetches({ id: 1 })).toBe(true);
  });

  it('the forecast’s own ticks and other desk topics fetch nothing', () => {
    expect(careNoticeRefetches({ id: 1, topics: ['forecast', 'counts', 'events'], version: 9 })).toBe(false);
    expect(careNoticeRefetches({ id: 1, topics: ['cabin-changes'] })).toBe(false);
  });
});
