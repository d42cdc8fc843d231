import { describe, expect, it } from 'vitest';
import { EMPTY_FILTERS, ledgerQueryString, withFilter } from './ledger-filters';
import { quarterOf, recentQuarters } from './quarters';

describe('ledger filters', () => {
  it('sends only what is set, and paging only for the list, never for the export', () => {
    const f = { ...EMPTY_FILTERS, stationId: 3, from: '2026-10-01', state: 'issued' as const, page: 2 };
    expect(ledgerQueryString(f, true)).toBe('stationId=3&from=2026-10-01&state=issued&page=2&pageSize=50');
    expect(ledgerQueryString(f, false)).toBe('stationId=3&from=2026-10-01&state=issued');
  });

  it('goes back to the first page when a filter changes', () => {
    expect(withFilter({ ...EMPTY_FILTERS, page: 4 }, 'regime', 'eu-261')).toMatchObject({ regime: 'eu-261', page: 1 });
    expect(withFilter(EMPTY_FILTERS, 'page', 3).page).toBe(3);
  });
});

// Calendar quarters end March 31, June 30, September 30 and December 31 (14 CFR 250.10).
describe('quarters', () => {
  it('names the quarter of a date', () => {
    expect(quarterOf(new Date('2026-12-01T00:00:00Z'))).toBe('2026-Q4');
    expect(quarterOf(new Date('2026-03-31T23:59:00Z'))).toBe('2026-Q1');
  });

  it('lists this quarter and the ones before it, across a year end', () => {
    expect(recentQuarters(new Date('2026-02-10T00:00:00Z'), 3)).toEqual(['2026-Q1', '2025-Q4', '2025-Q3']);
  });
});
