import { describe, expect, it } from 'vitest';
import type { DeskPassenger } from '@shared/schemas/flight-desk';
import { matchingBookings } from './passenger-search';

const p = (id: number, bookingId: number, pnr: string, firstName: string, lastName: string) => ({ id, bookingId, pnr, firstName, lastName }) as DeskPassenger;
const list = [p(1, 10, 'K7Q2XM', 'Ada', 'Okafor'), p(2, 10, 'K7Q2XM', 'Ben', 'Okafor'), p(3, 11, 'ZZ9AB1', 'Cy', 'Brightwater')];

describe('finding a booking at the counter', () => {
  it('finds the whole party by PNR or by one traveller’s name, ignoring case', () => {
    expect(matchingBookings(list, 'k7q2').map((b) => b.map((x) => x.id))).toEqual([[1, 2]]);
    expect(matchingBookings(list, 'ben oka').map((b) => b.map((x) => x.id))).toEqual([[1, 2]]);
    expect(matchingBookings(list, 'bright').map((b) => b.map((x) => x.id))).toEqual([[3]]);
  });

  it('finds nothing for an empty search or a name nobody has', () => {
    expect(matchingBookings(list, '   ')).toEqual([]);
    expect(matchingBookings(list, 'ada bright')).toEqual([]);
  });
});
