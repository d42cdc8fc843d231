// Seats as printed on boarding passes (row number and letter, e.g. 14C; common practice, no source), in the manifest
// and in the departure-control feed's check-in event.
import { describe, expect, it } from 'vitest';
import { integrationEventSchema } from './integration-events';
import { seatSchema } from './seat';

describe('seatSchema', () => {
  it.each([['14c', '14C'], [' 3A ', '3A'], ['120K', '120K'], ['', null]])('reads %j as %j', (cell, seat) => expect(seatSchema('seat').parse(cell)).toBe(seat));
  it.each(['aisle', '0A', '14', 'C14', '1000A', '14L'])('refuses %j, naming the field and the rule', (cell) => {
    const result = seatSchema('seat').safeParse(cell);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].message).toBe('seat must be a row number and a seat letter A-K (14C), or empty');
  });
});

describe('the feed’s check-in event', () => {
  const checkIn = { id: 'e1', occurredAt: '2026-03-10T17:00:00Z', flight: { carrier: 'ZZ', number: '105', date: '2026-03-10' }, type: 'passenger.checked-in', pnr: 'K7QX2M' };
  it('carries the seat check-in gave one passenger', () => {
    const e = integrationEventSchema.parse({ ...checkIn, sequence: 1, seat: '14c' });
    expect(e).toMatchObject({ type: 'passenger.checked-in', sequence: 1, seat: '14C' });
  });
  it('refuses a seat for a whole party (no sequence)', () => {
    const result = integrationEventSchema.safeParse({ ...checkIn, seat: '14C' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]).toMatchObject({ path: ['seat'], message: 'seat needs the passenger\'s sequence' });
  });
});
