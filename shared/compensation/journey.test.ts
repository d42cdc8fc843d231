import { describe, expect, it } from 'vitest';
import { compensationDue } from './index';
import { journeyScope, plannedDelayAtMeasured, type JourneyAirport, type JourneySegment } from './journey';
import { lowestCashFare } from './tickets';

// Coordinates: OpenFlights airports.dat (the dataset the server ships). Countries spelled as that dataset spells them.
const AIRPORTS: Record<string, JourneyAirport> = {
  FCO: { iata: 'FCO', country: 'Italy', lat: 41.8002778, lon: 12.2388889, eu: true },
  BRU: { iata: 'BRU', country: 'Belgium', lat: 50.902222, lon: 4.485833, eu: true },
  HAM: { iata: 'HAM', country: 'Germany', lat: 53.630389, lon: 9.988228, eu: true },
  BOS: { iata: 'BOS', country: 'United States', lat: 42.364347, lon: -71.005181, eu: false },
  MIA: { iata: 'MIA', country: 'United States', lat: 25.79325, lon: -80.290556, eu: false },
  SJU: { iata: 'SJU', country: 'Puerto Rico', lat: 18.439417, lon: -66.001833, eu: false },
  YUL: { iata: 'YUL', country: 'Canada', lat: 45.470556, lon: -73.740833, eu: false },
  YVR: { iata: 'YVR', country: 'Canada', lat: 49.193889, lon: -123.184444, eu: false },
  LHR: { iata: 'LHR', country: 'United Kingdom', lat: 51.4775, lon: -0.461389, eu: false },
};
const airport = (field: string, iata: string) => {
  const a = AIRPORTS[iata];
  if (!a) throw new RangeError(`${field}: no airport ${iata}`);
  return a;
};
const seg = (carrier: string, number: string, origin: string, destination: string, departure: string, arrival: string): JourneySegment => ({ carrier, number, origin, destination, departure, arrival });

describe('the journey each rule measures', () => {
  // Bossen (CJEU C-559/16, 7 Sep 2017): Rome-Brussels-Hamburg; the direct Rome-Hamburg distance of 1,326 km counts,
  // not the 1,173 + 483 km flown, so EUR 250 is due.
  const romeBrussels = seg('ZZ', '200', 'FCO', 'BRU', '2026-12-01T08:00:00+01:00', '2026-12-01T10:15:00+01:00');
  const brusselsHamburg = seg('ZZ', '310', 'BRU', 'HAM', '2026-12-01T11:30:00+01:00', '2026-12-01T12:40:00+01:00');

  it('EU: distance from the denied flight’s airport to the final destination, delay counted there', () => {
    const scope = journeyScope('eu-261', romeBrussels, [brusselsHamburg], airport);
    expect(scope.finalDestination).toBe('HAM');
    expect(scope.measuredTo).toBe('HAM');
    expect(Math.round(scope.distanceKm!)).toBe(1326); // C-559/16 Bossen
    expect(scope.intraCommunity).toBe(true);
    // The alternate reaches Brussels at 12:00, too late for the 11:30 onward flight: the agent gives the arrival in
    // Hamburg, 14:55, which is 2 h 15 min after the scheduled 12:40 (derived).
    expect(() => plannedDelayAtMeasured(scope, '2026-12-01T11:00:00Z')).toThrow(/arrivalAtDestination: required/);
    expect(plannedDelayAtMeasured(scope, '2026-12-01T11:00:00Z', '2026-12-01T14:55:00+01:00')).toBe(135);
    const due = compensationDue({ regime: 'eu-261', deniedOn: '2026-12-01', plannedArrivalDelayMinutes: 135, distanceKm: scope.distanceKm, intraCommunity: true });
    // Reg. 261/2004 Art. 7(1)(a): EUR 250 up to 1,500 km; 2 h 15 min is beyond the 2 h of Art. 7(2)(a): no halving.
    expect(due.amountMinor).toBe(25_000);
    expect(due.reducibleUnderArt7_2).toBe(false);
  });

  it('EU: an alternate that still makes the onward flight means no delay at the final destination', () => {
    const scope = journeyScope('eu-261', romeBrussels, [brusselsHamburg], airport);
    // 10:20 local (09:20Z) leaves 70 min before the 11:30 onward flight (KEEPS_CONNECTION_MINUTES = 60, common practice).
    expect(plannedDelayAtMeasured(scope, '2026-12-01T09:20:00Z')).toBe(0);
    expect(plannedDelayAtMeasured(scope, null)).toBeNull();
  });

  it('Canada: the destination on the ticket (SOR/2019-150 s. 20(1))', () => {
    const leg = seg('ZZ', '500', 'YUL', 'YYZ', '2026-12-01T07:00:00-05:00', '2026-12-01T08:15:00-05:00');
    const onward = seg('ZZ', '610', 'YYZ', 'YVR', '2026-12-01T09:30:00-05:00', '2026-12-01T11:45:00-08:00');
    const withYyz: Record<string, JourneyAirport> = { ...AIRPORTS, YYZ: { iata: 'YYZ', country: 'Canada', lat: 43.677223, lon: -79.630556, eu: false } };
    const scope = journeyScope('ca-appr', leg, [onward], (f, i) => withYyz[i] ?? airport(f, i));
    expect(scope.measuredTo).toBe('YVR');
    // Arrival in Vancouver 7 h late -> CAD 1,800 (APPR 6 h to under 9 h band; DOMAIN check value).
    const delay = plannedDelayAtMeasured(scope, '2026-12-01T20:00:00Z', '2026-12-01T18:45:00-08:00');
    expect(delay).toBe(420);
    expect(compensationDue({ regime: 'ca-appr', deniedOn: '2026-12-01', plannedArrivalDelayMinutes: delay }).amountMinor).toBe(180_000);
  });

  it('US: the first stopover (more than 4 h on the ground, 14 CFR 250.1) rather than the destination', () => {
    const bosMia = seg('ZZ', '101', 'BOS', 'MIA', '2026-12-01T07:00:00-05:00', '2026-12-01T10:30:00-05:00');
    const miaSju = seg('ZZ', '701', 'MIA', 'SJU', '2026-12-01T16:00:00-05:00', '2026-12-01T19:30:00-04:00');
    const scope = journeyScope('us-dot', bosMia, [miaSju], airport);
    expect(scope.measuredTo).toBe('MIA');
    expect(scope.measuredBecause).toMatch(/first stopover/);
    // With a 1 h 30 min connection MIA is no stopover: the delay is counted at San Juan.
    const quick = seg('ZZ', '703', 'MIA', 'SJU', '2026-12-01T12:00:00-05:00', '2026-12-01T15:30:00-04:00');
    expect(journeyScope('us-dot', bosMia, [quick], airport).measuredTo).toBe('SJU');
  });

  it('US: Puerto Rico is interstate air transportation (49 U.S.C. 40102(a)), so the domestic bands apply', () => {
    const bosSju = seg('ZZ', '105', 'BOS', 'SJU', '2026-12-01T07:00:00-05:00', '2026-12-01T11:40:00-04:00');
    const scope = journeyScope('us-dot', bosSju, [], airport);
    expect(scope.international).toBe(false);
    // Domestic: 2 h 30 min late -> 400 % band (14 CFR 250.5(a)(3)); fare $300 -> $1,200 (DOMAIN check value, derived).
    const due = compensationDue({ regime: 'us-dot', deniedOn: '2026-12-01', plannedArrivalDelayMinutes: 150, oneWayFare: { amountMinor: 30_000, currency: 'USD' }, international: scope.international });
    expect(due.amountMinor).toBe(120_000);
    const bosLhr = seg('ZZ', '109', 'BOS', 'LHR', '2026-12-01T19:00:00-05:00', '2026-12-02T06:40:00Z');
    expect(journeyScope('us-dot', bosLhr, [], airport).international).toBe(true);
  });

  it('refuses onward flights that do not join up, and an unknown airport', () => {
    const wrong = seg('ZZ', '310', 'HAM', 'BRU', '2026-12-01T11:30:00+01:00', '2026-12-01T12:40:00+01:00');
    expect(() => journeyScope('eu-261', romeBrussels, [wrong], airport)).toThrow(/itinerary\[0\]\.origin: must be BRU/);
    const early = { ...brusselsHamburg, departure: '2026-12-01T10:00:00+01:00' };
    expect(() => journeyScope('eu-261', romeBrussels, [early], airport)).toThrow(/itinerary\[0\]\.departure: must be after/);
    const nowhere = seg('ZZ', '999', 'BRU', 'XXX', '2026-12-01T11:30:00+01:00', '2026-12-01T12:40:00+01:00');
    expect(() => journeyScope('eu-261', romeBrussels, [nowhere], airport)).toThrow(/no airport XXX/);
  });
});

describe('award and zero-fare tickets, rule by rule', () => {
  const us = { regime: 'us-dot' as const, deniedOn: '2026-12-01', plannedArrivalDelayMinutes: 90, aircraftSeats: 150 };

  it('US: a miles ticket with cash taxes is priced at the lowest cash fare in its class (14 CFR 250.1, 250.5(d))', () => {
    // Taxes of $5.60 paid on an award ticket; the lowest cash fare in the cabin is $129: 200 % -> $258 (derived).
    const due = compensationDue({ ...us, ticket: 'frequent-flyer', oneWayFare: { amountMinor: 560, currency: 'USD' }, lowestCashFareSameClass: { amountMinor: 12_900, currency: 'USD' } });
    expect(due.amountMinor).toBe(25_800);
    expect(due.explanation).toMatch(/zero-fare/);
    expect(() => compensationDue({ ...us, ticket: 'frequent-flyer', oneWayFare: { amountMinor: 560, currency: 'USD' } })).toThrow(/lowestCashFareSameClass: required/);
  });

  it('US: the lowest cash fare comes from cash tickets of the same cabin only', () => {
    const onBoard = [
      { cabin: 'Y', fareMinor: 560, fareCurrency: 'USD', fareType: 'award' },
      { cabin: 'Y', fareMinor: 15_000, fareCurrency: 'USD', fareType: 'standard' },
      { cabin: 'Y', fareMinor: 12_900, fareCurrency: 'USD', fareType: 'flex' },
      { cabin: 'J', fareMinor: 9_000, fareCurrency: 'USD', fareType: 'standard' },
    ];
    expect(lowestCashFare(onBoard, 'Y', 'USD')).toBe(12_900);
    expect(lowestCashFare(onBoard, 'F', 'USD')).toBeNull();
  });

  it('EU: free and non-public reduced fares are outside the rule; frequent-flyer tickets are inside (Art. 3(3))', () => {
    const eu = { regime: 'eu-261' as const, deniedOn: '2026-12-01', plannedArrivalDelayMinutes: 300, distanceKm: 1326, intraCommunity: true };
    expect(compensationDue({ ...eu, ticket: 'free' })).toMatchObject({ amountMinor: 0, band: 'out-of-scope', ruleRef: 'Reg. (EC) 261/2004 Art. 3(3)' });
    expect(compensationDue({ ...eu, ticket: 'non-public-reduced' }).band).toBe('out-of-scope');
    const award = compensationDue({ ...eu, ticket: 'frequent-flyer' });
    expect(award.amountMinor).toBe(25_000); // Art. 7(1)(a)
    expect(award.notes.join(' ')).toMatch(/frequent-flyer/);
  });
});

describe('every input checked before scope', () => {
  it('an unknown exemption code is an error on a 20-seat aircraft too', () => {
    const small = { regime: 'us-dot' as const, deniedOn: '2026-12-01', plannedArrivalDelayMinutes: 90, aircraftSeats: 20, oneWayFare: { amountMinor: 20_000, currency: 'USD' } };
    expect(compensationDue(small).band).toBe('out-of-scope');
    expect(() => compensationDue({ ...small, exemption: 'made-up' })).toThrow(/exemption: unknown code "made-up"/);
    expect(() => compensationDue({ ...small, lowestCashFareSameClass: { amountMinor: -5, currency: 'USD' } })).toThrow(/lowestCashFareSameClass/);
    expect(() => compensationDue({ ...small, ticket: 'gift' as never })).toThrow(/ticket: expected one of/);
  });

  it('an unknown exemption code is an error for a volunteer and under every regime', () => {
    expect(() => compensationDue({ regime: 'eu-261', deniedOn: '2026-12-01', plannedArrivalDelayMinutes: null, voluntary: true, exemption: 'nope' })).toThrow(/unknown code/);
    expect(() => compensationDue({ regime: 'ca-appr', deniedOn: '2026-12-01', plannedArrivalDelayMinutes: null, exemption: 'eu-no-checkin' })).toThrow(/unknown code/);
  });
});
