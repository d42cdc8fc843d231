// The departure-control feed carries each booking's onward flights, checked like a manifest row; the database session
// runs in UTC. Runs on a station and flights of its own.
// Outside sources: ISO 8601 offsets (an instant with +01:00 is one hour ahead of UTC); MariaDB documents
// @@session.time_zone as the zone NOW() and TIMESTAMP values use (from memory).
import { removeFlights } from './volunteers-fixtures';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createdIntegrationKeySchema, eventBatchResponseSchema } from '@shared/schemas/integration-events';
import { BookingEntity, FlightEntity, PassengerEntity, StationEntity } from '../../server/src/db/entities';
import { insertCompensations } from './payments-harness';
import { Client, startTestApp, type TestApp } from './harness';
import { RUN_ID, TEST_PASSWORD, insertUser, removeRunUsers } from './helpers';

let t: TestApp;
let station: StationEntity;
let key: string;
const flightIds: number[] = [];

async function testStation(): Promise<StationEntity> {
  const repo = t.db.getRepository(StationEntity);
  return (await repo.findOneBy({ iata: 'BGO' })) ?? repo.save(repo.create({ iata: 'BGO', name: 'Bergen (API test station)', timeZone: 'Europe/Oslo', regime: 'eu-261', currency: 'NOK' }));
}

async function makeFlight(): Promise<FlightEntity> {
  const repo = t.db.getRepository(FlightEntity);
  const departure = new Date(Math.floor(Date.now() / 60_000) * 60_000 + 20 * 24 * 3_600_000);
  for (let attempt = 0; attempt < 20; attempt++) {
    const flightNumber = String(8000 + Math.floor(Math.random() * 1000));
    const serviceDate = departure.toISOString().slice(0, 10);
    if (await repo.existsBy({ carrierCode: 'ZZ', flightNumber, serviceDate, origin: 'BGO' })) continue;
    const f = await repo.save(repo.create({ stationId: station.id, carrierCode: 'ZZ', flightNumber, serviceDate, origin: 'BGO', destination: 'OSL', scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + 3_600_000), aircraftType: null, seatsByCabin: { Y: 4 }, gate: null, state: 'check-in-open', shock: null }));
    flightIds.push(f.id);
    return f;
  }
  throw new Error('no free flight number');
}

let seq = 0;
function booking(f: FlightEntity, pnr: string, extra: Record<string, unknown>, people = 1) {
  const passengers = Array.from({ length: people }, (_, i) => ({ firstName: `P${i}`, lastName: 'Feedwell', cabin: 'Y', fareMinor: 99_000, fareCurrency: 'NOK' }));
  return { id: `journey-${RUN_ID}-${seq++}`, type: 'booking.added', occurredAt: new Date().toISOString(), flight: { carrier: 'ZZ', number: f.flightNumber, date: f.serviceDate }, pnr, passengers, ...extra };
}
const feed = (...events: object[]) => request(t.app).post('/api/integrations/events').set('Authorization', `Bearer ${key}`).send({ events });

beforeAll(async () => {
  t = await startTestApp();
  station = await testStation();
  const admin = await insertUser(t.db, { label: 'journey-admin', role: 'admin', stationIds: [station.id] });
  const c = new Client(t.app);
  expect((await c.signIn(admin.email, TEST_PASSWORD)).status).toBe(200);
  key = createdIntegrationKeySchema.parse((await c.post(`/api/stations/${station.id}/integration-keys`, { name: `journey ${RUN_ID}` }).expect(201)).body).key;
});
afterAll(async () => {
  if (flightIds.length) {
    await removeFlights(t.db, flightIds);
  }
  await removeRunUsers(t.db);
  await t.close();
});

describe('the feed carries the journey', () => {
  it('stores the onward flights of a booking and refuses ones that do not join this flight', async () => {
    const f = await makeFlight();
    const onward = { carrier: 'ZZ', number: '812', origin: 'OSL', destination: 'HAM', departure: new Date(f.scheduledArrival.getTime() + 7_200_000).toISOString(), arrival: new Date(f.scheduledArrival.getTime() + 14_400_000).toISOString() };
    const res = eventBatchResponseSchema.parse((await feed(
      booking(f, 'FEED01', { itinerary: [onward] }),
      booking(f, 'FEED02', { itinerary: [{ ...onward, origin: 'BGO' }] }),
      booking(f, 'FEED03', { itinerary: [{ ...onward, destination: 'QQQ' }] }),
      booking(f, 'FEED04', { passengers: [{ firstName: 'A', lastName: 'B', cabin: 'Y', fareMinor: 0, fareCurrency: 'NOK', fareType: 'gift' }] }),
    ).expect(200)).body);
    expect(res.results.map((r) => r.status)).toEqual(['applied', 'rejected', 'rejected', 'rejected']);
    expect(res.results[1].details).toEqual([{ field: 'itinerary[0].origin', rule: 'must be OSL, where the flight before it arrives (got BGO)' }]);
    expect(res.results[2].details?.[0]).toMatchObject({ field: 'itinerary[0].destination' });
    expect(JSON.stringify(res.results[3].details)).toMatch(/fareType must be one of standard, flex, award, staff, free/);
    const stored = await t.db.getRepository(BookingEntity).findOneByOrFail({ flightId: f.id, pnr: 'FEED01' });
    expect(stored.itinerary).toEqual([onward]);
  });

  it('refuses a booking that would take the flight over capacity times the station factor', async () => {
    // 4 seats × 1.5 = 6 bookings at most (derived from the default 15000 basis points).
    const f = await makeFlight();
    const res = eventBatchResponseSchema.parse((await feed(booking(f, 'FULL01', {}, 5), booking(f, 'FULL02', {}, 2), booking(f, 'FULL03', {}, 1)).expect(200)).body);
    expect(res.results.map((r) => r.status)).toEqual(['applied', 'rejected', 'applied']);
    expect(res.results[1].details).toEqual([{ field: 'passengers', rule: expect.stringContaining('would hold 7 booked passengers; BGO allows at most 6 (4 seats × 1.5 maximum overbooking)') }]);
  });
});

describe('the database session', () => {
  it('runs in UTC on every pooled connection, whatever the server’s own zone', async () => {
    const zones = await Promise.all(Array.from({ length: 5 }, () => t.db.query('SELECT @@session.time_zone AS tz')));
    for (const [row] of zones) expect(row.tz).toBe('+00:00');
  });
});

describe('a cancelled booking sent again', () => {
  it('comes back with fresh passengers when nothing names them', async () => {
    const f = await makeFlight();
    const cancel = { id: `journey-${RUN_ID}-${seq++}`, type: 'booking.cancelled', occurredAt: new Date().toISOString(), flight: { carrier: 'ZZ', number: f.flightNumber, date: f.serviceDate }, pnr: 'BACK01' };
    const res = eventBatchResponseSchema.parse((await feed(booking(f, 'BACK01', {}), cancel, booking(f, 'BACK01', {}, 2)).expect(200)).body);
    expect(res.results.map((r) => r.status)).toEqual(['applied', 'applied', 'applied']);
    const stored = await t.db.getRepository(BookingEntity).findOneByOrFail({ flightId: f.id, pnr: 'BACK01' });
    expect(stored.status).toBe('active');
    expect(await t.db.getRepository(PassengerEntity).countBy({ bookingId: stored.id })).toBe(2);
  });

  it('is refused naming the PNR, and changes nothing, when a compensation names one of its passengers', async () => {
    const f = await makeFlight();
    expect(eventBatchResponseSchema.parse((await feed(booking(f, 'BACK02', {})).expect(200)).body).results[0].status).toBe('applied');
    const stored = await t.db.getRepository(BookingEntity).findOneByOrFail({ flightId: f.id, pnr: 'BACK02' });
    const passengers = await t.db.getRepository(PassengerEntity).findBy({ bookingId: stored.id });
    await insertCompensations(t.db, f, passengers, () => ({ currency: 'NOK', regime: 'eu-261' }));
    const cancel = { id: `journey-${RUN_ID}-${seq++}`, type: 'booking.cancelled', occurredAt: new Date().toISOString(), flight: { carrier: 'ZZ', number: f.flightNumber, date: f.serviceDate }, pnr: 'BACK02' };
    const res = eventBatchResponseSchema.parse((await feed(cancel, booking(f, 'BACK02', {}, 2)).expect(200)).body);
    expect(res.results.map((r) => r.status)).toEqual(['applied', 'rejected']);
    expect(res.results[1].details?.[0]).toMatchObject({ field: 'pnr' });
    expect((await t.db.getRepository(PassengerEntity).findBy({ bookingId: stored.id })).map((p) => p.id)).toEqual(passengers.map((p) => p.id));
    expect((await t.db.getRepository(BookingEntity).findOneByOrFail({ id: stored.id })).status).toBe('cancelled');
  });
});
