// Compensation measured on the booking's whole journey through the API (propose -> authorize -> rebook). Check values
// and their sources beside each case; distances from the airport dataset the server ships (OpenFlights).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BookingEntity, PassengerEntity, type FlightEntity } from '../../server/src/db/entities';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO } from './helpers';
import { addBooking, addSingles, createFlight, removeDenialFixtures, type PassengerSpec } from './denials-fixtures';

let t: TestApp;
let agent: Client;
let supervisor: Client;

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor] = await Promise.all([signedIn(t, DEMO.agent), signedIn(t, DEMO.supervisor)]);
});
afterAll(async () => {
  await removeDenialFixtures(t.db);
  await t.close();
});

const at = (base: Date, minutes: number) => new Date(base.getTime() + minutes * 60_000).toISOString();

interface Setup {
  station: string;
  destination: string;
  currency: string;
  denied: PassengerSpec;
  fareType?: string;
  /** Onward flight from the destination: minutes after this flight lands, and its block time. */
  onward?: { to: string; leavesAfter: number; block: number };
  alternateLaterBy: number;
}

async function authorizedCase(s: Setup) {
  // A 150-seat aircraft (in every rule's scope) whose economy cabin has two seats for three passengers present: a
  // real shortfall of one, which a proposal needs.
  const flight = await createFlight(t.db, { station: s.station, destination: s.destination, cabins: { J: 148, Y: 2 } });
  await addSingles(t.db, flight, 2, { fareMinor: 20_000, fareCurrency: s.currency });
  const { booking, passengers } = await addBooking(t.db, flight, [{ checkedInBefore: 60, fareCurrency: s.currency, ...s.denied }]);
  if (s.onward) {
    const itinerary = [{ carrier: 'ZZ', number: '4410', origin: s.destination, destination: s.onward.to, departure: at(flight.scheduledArrival, s.onward.leavesAfter), arrival: at(flight.scheduledArrival, s.onward.leavesAfter + s.onward.block) }];
    await t.db.getRepository(BookingEntity).update({ id: booking.id }, { itinerary });
  }
  if (s.fareType) await t.db.getRepository(PassengerEntity).update({ id: passengers[0].id }, { fareType: s.fareType });
  const alternate = await createFlight(t.db, { station: s.station, destination: s.destination, seats: 150, after: flight, laterBy: s.alternateLaterBy });
  const proposal = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'oversold at the gate' }).expect(201)).body;
  await supervisor.post(`/api/denial-proposals/${proposal.id}/authorize`).expect(200);
  return { flight: flight as FlightEntity, alternate, denialId: proposal.denials[0].id as number };
}

describe('EU: the final destination on the ticket (Art. 2(h), 7(1); C-559/16 Bossen)', () => {
  it('Rome-Brussels with an onward flight to Dublin: the Rome-Dublin distance sets the band, the delay counts in Dublin', async () => {
    // Great-circle FCO-BRU is about 1,173 km (Bossen) but FCO-DUB is about 1,888 km (derived: WGS84 geodesic on the OpenFlights coordinates):
    // an intra-Community flight over 1,500 km is EUR 400 (Art. 7(1)(b)), not the EUR 250 of the leg alone.
    const c = await authorizedCase({ station: 'FCO', destination: 'BRU', currency: 'EUR', denied: { first: 'Dora', last: 'Dublinward', fareMinor: 9_900 }, onward: { to: 'DUB', leavesAfter: 180, block: 140 }, alternateLaterBy: 60 });
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate.id }).expect(200);
    const [owed] = res.body.denial.compensation.passengers;
    expect(owed).toMatchObject({ amountMinor: 40_000, currency: 'EUR', band: 'eu-b', problem: null });
    // The alternate lands 60 min later and still leaves 120 min for the onward flight: no delay in Dublin (derived).
    expect(res.body.denial.rebooking.plannedArrivalDelayMinutes).toBe(0);
    expect(res.body.denial.compensation.basis).toMatch(/measured to DUB \(journey FCO-BRU-DUB\)/);
    expect(res.body.denial.journey).toMatchObject({ finalDestination: 'DUB', measuredTo: 'DUB', measuredToTimeZone: 'Europe/Dublin', legDestinationTimeZone: 'Europe/Brussels' });
  });

  it('an alternate that misses the onward flight needs the planned arrival at the final destination, named as the field', async () => {
    const c = await authorizedCase({ station: 'FCO', destination: 'BRU', currency: 'EUR', denied: { first: 'Mika', last: 'Missed', fareMinor: 9_900 }, onward: { to: 'DUB', leavesAfter: 60, block: 140 }, alternateLaterBy: 120 });
    const refused = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate.id }).expect(400);
    expect(refused.body.details[0]).toMatchObject({ field: 'arrivalAtDestination' });
    expect(await t.db.query('SELECT id FROM rebookings WHERE denial_id = ?', [c.denialId])).toEqual([]); // nothing held
    // Planned arrival in Dublin 3 h 30 min after the original schedule there: over the 3 h of Art. 7(2)(b), so the full
    // EUR 400 with no reduction to offer (derived).
    const scheduledDublin = new Date(c.flight.scheduledArrival.getTime() + 200 * 60_000);
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate.id, arrivalAtDestination: at(scheduledDublin, 210) }).expect(200);
    expect(res.body.denial.rebooking.plannedArrivalDelayMinutes).toBe(210);
    expect(res.body.denial.compensation.passengers[0]).toMatchObject({ amountMinor: 40_000, band: 'eu-b' });
  });
});

describe('US: territories are interstate; award tickets at the lowest cash fare (14 CFR 250.1, 250.5)', () => {
  it('Boston-San Juan is domestic for Part 250: 2 h 30 min late is the 400 % band, not the international 200 %', async () => {
    // 49 U.S.C. 40102(a): Puerto Rico counts with the states for interstate air transportation. Domestic, 2 h or more
    // -> 400 % of USD 250 = USD 1,000 (250.5(a)(3)); read as international it would be 200 % = USD 500 (250.5(b)(2)).
    const c = await authorizedCase({ station: 'BOS', destination: 'SJU', currency: 'USD', denied: { first: 'Rosa', last: 'Islena', fareMinor: 25_000 }, alternateLaterBy: 150 });
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate.id }).expect(200);
    expect(res.body.denial.compensation.passengers[0]).toMatchObject({ amountMinor: 100_000, band: 'us-400pct', ruleRef: '14 CFR 250.5(a)(3)' });
  });

  it('a miles ticket with USD 5.60 of taxes is priced at the lowest cash fare in its cabin on the flight', async () => {
    // Cash fares in the cabin: USD 200 each (the two singles); 90 min late domestic -> 200 % of USD 200 = USD 400 (250.5(a)(2), (d)).
    const c = await authorizedCase({ station: 'BOS', destination: 'ORD', currency: 'USD', denied: { first: 'Axel', last: 'Awardson', fareMinor: 560 }, fareType: 'award', alternateLaterBy: 90 });
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate.id }).expect(200);
    const [owed] = res.body.denial.compensation.passengers;
    expect(owed).toMatchObject({ amountMinor: 40_000, band: 'us-200pct' });
    expect(owed.explanation).toMatch(/lowest cash fare in the same class, zero-fare ticket/);
  });
});
