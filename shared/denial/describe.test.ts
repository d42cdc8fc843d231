import { describe, expect, it } from 'vitest';
import { describeRules, parsePriorityRules, priorityRulesSchema } from './index';

describe('describeRules', () => {
  it('prints the carrier rules in order, then ties, parties and the protected groups', () => {
    const lines = describeRules([
      { factor: 'check-in-time', direction: 'latest-first' },
      { factor: 'fare-paid', direction: 'lowest-first' },
      { factor: 'frequent-flyer-tier' },
    ]);
    expect(lines[0]).toContain('volunteers');
    expect(lines[2]).toMatch(/^1\. Check-in time: passengers who checked in latest/);
    expect(lines[3]).toMatch(/^2\. Fare paid: .*lowest fare/);
    expect(lines[4]).toMatch(/^3\. Frequent-flyer status/);
    const text = lines.join(' ');
    for (const group of ['unaccompanied minors', 'disability', 'families travelling with children', 'already denied', 'boarded']) {
      expect(text).toContain(group);
    }
  });

  it('under Canada\'s rules the groups are an order of priority, not "never selected" (SOR/2019-150 s.15, from memory)', () => {
    const text = describeRules([{ factor: 'check-in-time', direction: 'latest-first' }], 'ca-appr').join(' ');
    expect(text).toContain('selected only after everyone else');
    expect(text).toMatch(/\(a\) unaccompanied minors; \(b\) passengers with a disability and their support person or companion; \(c\) passengers travelling with family members; \(d\) passengers already denied boarding on the same ticket/);
    expect(text).not.toContain('Never selected: unaccompanied minors');
    expect(text).toContain('did not check in in time is a no-show');
  });

  it('refuses an invalid rules list like the ranking does', () => {
    expect(() => describeRules([{ factor: 'lottery' } as never])).toThrow(/^rules\[0\]\.factor:/);
  });
});

describe('priority rules schema (zod)', () => {
  it('fills the single-direction factors with their default', () => {
    expect(parsePriorityRules([{ factor: 'seat-assigned-before-gate' }, { factor: 'frequent-flyer-tier' }])).toEqual([
      { factor: 'seat-assigned-before-gate', direction: 'unassigned-first' },
      { factor: 'frequent-flyer-tier', direction: 'none-first' },
    ]);
  });

  it('rejects unknown keys, missing directions and duplicates', () => {
    expect(priorityRulesSchema.safeParse([{ factor: 'fare-paid', direction: 'lowest-first', weight: 2 }]).success).toBe(false);
    expect(priorityRulesSchema.safeParse([{ factor: 'fare-paid' }]).success).toBe(false);
    expect(priorityRulesSchema.safeParse([{ factor: 'fare-paid', direction: 'lowest-first' }, { factor: 'fare-paid', direction: 'highest-first' }]).success).toBe(false);
  });
});
