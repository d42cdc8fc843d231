import { describe, expect, it } from 'vitest';
import type { DeskPassenger } from '@shared/schemas/flight-desk';
import { passenger } from './test-passenger';
import { filterChoices, matchesConnection, matchesSearch, matchesSsr, matchesStatus } from './passenger-filters';


describe('search', () => {
  const p = passenger();
  it('finds by last name without accents or case', () => expect(matchesSearch(p, 'muller')).toBe(true));
  it('finds by first and last name in either order', () => {
    expect(matchesSearch(p, 'jurgen muller')).toBe(true);
    expect(matchesSearch(p, 'Müller Jürgen')).toBe(true);
  });
  it('finds by the PNR as printed on a boarding pass (common practice: LAST/FIRST)', () => expect(matchesSearch(p, 'MULLER/JURGEN')).toBe(true));
  it('finds by PNR', () => expect(matchesSearch(p, 'k7qx')).toBe(true));
  it('finds by seat as printed on a boarding pass, in any case', () => {
    expect(matchesSearch(passenger({ seat: '14C' }), '14c')).toBe(true);
    expect(matchesSearch(passenger({ seat: '14C' }), 'muller 14C')).toBe(true);
    expect(matchesSearch(passenger({ seat: '14C' }), '15C')).toBe(false);
    expect(matchesSearch(passenger({ seat: null }), '14C')).toBe(false);
  });
  it('does not match someone else', () => expect(matchesSearch(p, 'okafor')).toBe(false));
  it('matches everyone when empty', () => expect(matchesSearch(p, '  ')).toBe(true));
});

describe('filters', () => {
  it('"still to board" means booked or checked in, not boarded, offloaded or cancelled', () => {
    expect(['booked', 'checked-in', 'boarded', 'offloaded', 'cancelled'].map((s) => matchesStatus(passenger({ status: s as DeskPassenger['status'] }), 'not-boarded'))).toEqual([
      true, true, false, false, false,
    ]);
  });
  it('tells connecting passengers from those starting here', () => {
    const connecting = passenger({ inboundFlight: 'ZZ318' });
    expect(matchesConnection(connecting, 'connecting')).toBe(true);
    expect(matchesConnection(connecting, 'local')).toBe(false);
    expect(matchesConnection(passenger(), 'local')).toBe(true);
  });
  it('filters by any SSR or by one code', () => {
    const wheelchair = passenger({ ssrCodes: ['WCHR'] });
    expect(matchesSsr(wheelchair, 'any')).toBe(true);
    expect(matchesSsr(wheelchair, 'WCHR')).toBe(true);
    expect(matchesSsr(wheelchair, 'UMNR')).toBe(false);
    expect(matchesSsr(passenger(), 'any')).toBe(false);
  });
  it('offers only the cabins and SSR codes on the flight, sorted', () => {
    expect(filterChoices([passenger({ cabin: 'Y', ssrCodes: ['WCHR'] }), passenger({ cabin: 'J', ssrCodes: ['BLND', 'WCHR'] })])).toEqual({ cabins: ['J', 'Y'], ssrCodes: ['BLND', 'WCHR'] });
  });
});
