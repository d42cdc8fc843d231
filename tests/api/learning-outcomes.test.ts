// When a flight has left, each booking's outcome is kept with what was known 24, 3 and 1 hours before departure;
// a flight the feed never reported boarding for is left out; recording twice keeps one record. The flights here are
// of a test station of their own (Trondheim, a real airport), removed afterwards.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { In } from 'typeorm';
import { BookingEntity, BookingOutcomeEntity, ClosedFlightEntity, FlightEntity, PassengerEntity, StationEntity } from '../../server/src/db/entities';
import { recordDepartedFlights } from '../../server/src/modules/learning/outcomes.service';
import { startTestApp, type TestApp } from './harness';

let t: TestApp;
let station: StationEntity;
const flightIds: number[] = [];
const HOUR = 3_600_000;

async function departedFlight(departure: Date, people: Array<{ status: PassengerEntity['status']; checkedInHoursBefore: number | null; inbound?: string; channel?: BookingEntity['channel'] }>) {
  const flight = await t.db.getRepository(FlightEntity).save({
    stationId: station.id, carrierCode: 'ZZ', flightNumber: String(7000 + Math.floor(Math.random() * 2000)), serviceDate: departure.toISOString().slice(0, 10),
    origin: 'TRD', destination: 'OSL', scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + HOUR), aircraftType: null,
    seatsByCabin: { Y: 3 }, gate: null, state: 'departed', shock: null,
  });
  flightIds.push(flight.id);
  const ids: number[] = [];
  for (const [i, p] of people.entries()) {
    const booking = await t.db.getRepository(BookingEntity).save({ flightId: flight.id, pnr: `TRD00${i}`, contactEmail: null, channel: p.channel ?? null, travelsTogether: true, status: 'active' as const });
    const { identifiers } = await t.db.getRepository(PassengerEntity).insert({
      bookingId: booking.id, flightId: flight.id, pnrSequence: 1, firstName: 'Test', lastName: `Person${i}`, cabin: 'Y', fareMinor: 10000, fareCurrency: 'NOK',
      fareType: 'standard', ssrCodes: [], frequentFlyerTier: null, isChild: false, inboundFlight: p.inbound ?? null, inboundScheduledArrival: null,
      inboundEstimatedArrival: null, seat: null, status: p.status, checkedInAt: p.checkedInHoursBefore === null ? null : new Date(departure.getTime() - p.checkedInHoursBefore * HOUR),
      boardedAt: null, statusChangedAt: null,
    });
    ids.push(Number(identifiers[0].id));
  }
  return { flight, passengerIds: ids };
}

beforeAll(async () => {
  t = await startTestApp();
  const repo = t.db.getRepository(StationEntity);
  station = (await repo.findOneBy({ iata: 'TRD' })) ?? (await repo.save(repo.create({ iata: 'TRD', name: 'Trondheim (API test station)', timeZone: 'Europe/Oslo', regime: 'eu-261', currency: 'NOK' })));
});

afterAll(async () => {
  if (flightIds.length) {
    await t.db.getRepository(ClosedFlightEntity).delete({ flightId: In(flightIds) });
    await t.db.getRepository(PassengerEntity).delete({ flightId: In(flightIds) });
    await t.db.getRepository(BookingEntity).delete({ flightId: In(flightIds) });
    await t.db.getRepository(FlightEntity).delete({ id: In(flightIds) });
  }
  await t.close();
});

describe('recording departed flights', () => {
  it('keeps each booking’s outcome with its check-in state at 24, 3 and 1 hours out, once', async () => {
    const departure = new Date(Date.now() - 26 * HOUR);
    const { flight, passengerIds } = await departedFlight(departure, [
      { status: 'boarded', checkedInHoursBefore: 30, channel: 'app' },
      { status: 'boarded', checkedInHoursBefore: 2, channel: 'corporate' },
      { status: 'checked-in', checkedInHoursBefore: 0.5, channel: 'agency' },
      { status: 'booked', checkedInHoursBefore: null, inbound: 'ZZ 9', channel: 'web' },
      { status: 'booked', checkedInHoursBefore: null },
    ]);
    await recordDepartedFlights(t.db);
    await recordDepartedFlights(t.db);
    const closed = await t.db.getRepository(ClosedFlightEntity).findBy({ flightId: flight.id });
    expect(closed).toHaveLength(1);
    expect(closed[0]).toMatchObject({ stationId: station.id, origin: 'TRD', destination: 'OSL', demo: false });
    const rows = await t.db.getRepository(BookingOutcomeEntity).find({ where: { closedFlightId: closed[0].id }, order: { passengerId: 'ASC' } });
    expect(rows.map((r) => [r.passengerId, r.outcome, r.checkedInT24, r.checkedInT3, r.checkedInT1, r.connecting, r.channel])).toEqual([
      [passengerIds[0], 'showed', true, true, true, false, 'app'],
      [passengerIds[1], 'showed', false, false, true, false, 'corporate'],
      [passengerIds[2], 'no-show', false, false, false, false, 'agency'],
      [passengerIds[3], 'missed-connection', false, false, false, true, 'web'],
      // A booking whose source named no channel is kept as 'unknown'.
      [passengerIds[4], 'no-show', false, false, false, false, 'unknown'],
    ]);
    expect(rows.every((r) => r.partySize === 1 && r.fareClass === 'standard' && r.cabin === 'Y')).toBe(true);
  });

  it('leaves out a flight the feed never reported boarding for', async () => {
    const { flight } = await departedFlight(new Date(Date.now() - 5 * HOUR), [
      { status: 'checked-in', checkedInHoursBefore: 2 },
      { status: 'booked', checkedInHoursBefore: null },
    ]);
    await recordDepartedFlights(t.db);
    expect(await t.db.getRepository(ClosedFlightEntity).countBy({ flightId: flight.id })).toBe(0);
  });
});
