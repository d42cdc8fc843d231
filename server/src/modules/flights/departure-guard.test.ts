// The clock half of the guard, without a database. The grace is the station's; the 10-minute default mirrors the
// clock that moves flight states along (common practice for a narrow-body turn, no outside source).
import { describe, expect, it } from 'vitest';
import { hasDeparted } from './departure-guard';

const at = (iso: string) => new Date(iso);
const flight = (state: 'scheduled' | 'boarding' | 'closed' | 'departed' | 'cancelled') => ({ state, scheduledDeparture: at('2034-03-01T12:00:00Z') });

describe('hasDeparted', () => {
  it('believes an explicit departed state from the feed or the desk, even before the scheduled time', () => {
    expect(hasDeparted(flight('departed'), 10, at('2034-03-01T11:00:00Z'))).toBe(true);
  });

  it('counts the flight as gone only after the scheduled time plus the grace', () => {
    expect(hasDeparted(flight('boarding'), 10, at('2034-03-01T12:10:00Z'))).toBe(false);
    expect(hasDeparted(flight('boarding'), 10, at('2034-03-01T12:10:01Z'))).toBe(true);
    expect(hasDeparted(flight('closed'), 0, at('2034-03-01T12:00:01Z'))).toBe(true);
  });

  it('never calls a cancelled flight departed', () => {
    expect(hasDeparted(flight('cancelled'), 10, at('2034-03-02T12:00:00Z'))).toBe(false);
  });
});
