// A made-up passenger for tests, with every field set; each test overrides what it is about.
import type { DeskPassenger } from '@shared/schemas/flight-desk';

export function passenger(over: Partial<DeskPassenger> = {}): DeskPassenger {
  return {
    id: 1, bookingId: 1, pnr: 'K7QX2M', pnrSequence: 1, partySize: 1, firstName: 'Jürgen', lastName: 'Müller', cabin: 'Y',
    fareMinor: 18900, fareCurrency: 'USD', fareType: 'standard', ssrCodes: [], frequentFlyerTier: null, isChild: false,
    inboundFlight: null, inboundEstimatedArrival: null, status: 'booked', checkedInAt: null, boardedAt: null,
    showProbability: 0.93, why: 'Typical for this route', seat: null, ...over,
  };
}
