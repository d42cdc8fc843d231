import { describe, expect, it } from 'vitest';
import { dueStatus } from './due-status';

describe('dueStatus', () => {
  const due = '2025-03-03T12:00:00.000Z';
  it('in time, due soon within 2 h (common practice), overdue after the deadline', () => {
    expect(dueStatus(due, new Date('2025-03-03T09:59:59Z'))).toBe('in-time');
    expect(dueStatus(due, new Date('2025-03-03T10:00:00Z'))).toBe('due-soon');
    expect(dueStatus(due, new Date('2025-03-03T12:00:00Z'))).toBe('due-soon');
    expect(dueStatus(due, new Date('2025-03-03T12:00:00.001Z'))).toBe('overdue');
    expect(dueStatus(null, new Date())).toBeNull();
    expect(() => dueStatus('soon', new Date())).toThrow(/^dueBy:/);
  });
});
