// Flights and weekly schedules kept by hand from the admin screens: created on the station's clock, edited, cancelled,
// each change audited; another station's flights answer "not found"; bad input names the field and the rule.
// Check values: clock changes in America/New_York follow the US Energy Policy Act of 2005 (second Sunday of March,
// first Sunday of November, at 02:00 local), so 14 March 2027 has no 02:30 and EST is UTC-5, EDT UTC-4.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { adminFlightSchema, scheduleResultSchema } from '@shared/schemas/admin-flights';
import { AuditLogEntity } from '../../server/src/db/entities';
import { Client, startTestApp, type TestApp } from './harness';
import { TEST_PASSWORD, foreignStation, insertUser, removeRunUsers, stationIdByIata } from './helpers';

let t: TestApp;
let admin: Client;
let bos: number;
let foreign: number;
// A flight number no other run or demo flight uses (four digits and a letter suffix).
const NUMBER = `${1000 + Math.floor(Math.random() * 8999)}Q`;
const SCHEDULED = `${1000 + Math.floor(Math.random() * 8999)}S`;

beforeAll(async () => {
  t = await startTestApp();
  bos = await stationIdByIata(t.db, 'BOS');
  foreign = (await foreignStation(t.db)).id;
  const user = await insertUser(t.db, { label: 'flights-admin', role: 'admin', stationIds: [bos] });
  admin = new Client(t.app);
  expect((await admin.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
});
afterAll(async () => {
  await t.db.query('DELETE p FROM passengers p JOIN flights f ON f.id = p.flight_id WHERE f.flight_number = ?', [SCHEDULED]);
  await t.db.query('DELETE b FROM bookings b JOIN flights f ON f.id = b.flight_id WHERE f.flight_number = ?', [SCHEDULED]);
  await t.db.query('DELETE FROM flights WHERE carrier_code = ? AND flight_number IN (?, ?)', ['ZZ', NUMBER, SCHEDULED]);
  await t.db.query('DELETE FROM flight_schedules WHERE carrier_code = ? AND flight_number = ?', ['ZZ', SCHEDULED]);
  await removeRunUsers(t.db);
  await t.close();
});

const body = (over: Record<string, unknown> = {}) => ({ carrierCode: 'zz', flightNumber: NUMBER, serviceDate: '2026-12-20', departureTime: '08:15', blockMinutes: 150, destination: 'ORD', seatsByCabin: { J: 12, Y: 138 }, aircraftType: '321', ...over });

describe('a flight made by hand', () => {
  let id: number;
  it('is created on the station clock: 08:15 in Boston on 20 December is 13:15 UTC (EST, UTC-5)', async () => {
    const res = await admin.post(`/api/stations/${bos}/flights`, body());
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const f = adminFlightSchema.parse(res.body);
    id = f.id;
    expect(f).toMatchObject({ carrierCode: 'ZZ', origin: 'BOS', destination: 'ORD', state: 'scheduled', departureTime: '08:15', blockMinutes: 150 });
    expect(f.scheduledDeparture).toBe('2026-12-20T13:15:00.000Z');
    expect(f.scheduledArrival).toBe('2026-12-20T15:45:00.000Z');
    const rows = await t.db.getRepository(AuditLogEntity).findBy({ action: 'flight.created', entityId: String(id) });
    expect(rows).toHaveLength(1);
  });

  it('is refused a second time for the same number and day', async () => {
    const res = await admin.post(`/api/stations/${bos}/flights`, body());
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('flight_exists');
  });

  it('names the field and the rule for each bad input, storing nothing', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ departureTime: '25:00' }, 'departureTime'],
      [{ blockMinutes: 5 }, 'blockMinutes'],
      [{ destination: 'XXQ' }, 'destination'],
      [{ seatsByCabin: {} }, 'seatsByCabin'],
      [{ serviceDate: '2026-02-30' }, 'serviceDate'],
      // The clocks jump from 02:00 to 03:00 in Boston that night: 02:30 never happens.
      [{ serviceDate: '2027-03-14', departureTime: '02:30' }, 'departureTime'],
    ];
    for (const [over, field] of cases) {
      const res = await admin.post(`/api/stations/${bos}/flights`, body({ ...over, flightNumber: '9Z' }));
      expect(res.status, JSON.stringify(over)).toBe(400);
      expect(res.body.details.map((d: { field: string }) => d.field), JSON.stringify(res.body)).toContain(field);
    }
    const [{ n }] = await t.db.query("SELECT COUNT(*) AS n FROM flights WHERE flight_number = '9Z'");
    expect(Number(n)).toBe(0);
  });

  it('is edited (time, seats, gate) with the change audited before and after', async () => {
    const res = await admin.patch(`/api/flights/${id}`, { departureTime: '09:05', seatsByCabin: { J: 12, Y: 144 }, gate: 'B12' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ departureTime: '09:05', blockMinutes: 150, gate: 'B12', seatsByCabin: { J: 12, Y: 144 } });
    expect(res.body.scheduledDeparture).toBe('2026-12-20T14:05:00.000Z');
    const [row] = await t.db.getRepository(AuditLogEntity).find({ where: { action: 'flight.updated', entityId: String(id) } });
    expect(row.before).toMatchObject({ departureTime: '08:15' });
    expect(row.after).toMatchObject({ departureTime: '09:05', gate: 'B12' });
  });

  it('is listed for its date range, and another station answers "not found"', async () => {
    const res = await admin.get(`/api/stations/${bos}/flights?from=2026-12-20&to=2026-12-20`);
    expect(res.status).toBe(200);
    expect(res.body.flights.map((f: { id: number }) => f.id)).toContain(id);
    expect((await admin.get(`/api/stations/${foreign}/flights?from=2026-12-20&to=2026-12-20`)).status).toBe(404);
    expect((await admin.get(`/api/stations/${bos}/flights?from=2026-12-20&to=2026-11-01`)).body.details[0].field).toBe('to');
  });

  it('is cancelled with a reason, and then refuses edits', async () => {
    expect((await admin.post(`/api/flights/${id}/cancel`, { reason: '' })).body.details[0].field).toBe('reason');
    const res = await admin.post(`/api/flights/${id}/cancel`, { reason: 'Aircraft reassigned' });
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('cancelled');
    const [row] = await t.db.getRepository(AuditLogEntity).findBy({ action: 'flight.cancelled', entityId: String(id) });
    expect(row.after).toMatchObject({ state: 'cancelled', reason: 'Aircraft reassigned' });
    expect((await admin.patch(`/api/flights/${id}`, { gate: 'C1' })).status).toBe(409);
    expect((await admin.post(`/api/flights/${id}/cancel`, { reason: 'again' })).status).toBe(409);
  });
});

describe('a weekly schedule', () => {
  let scheduleId: number;
  const depOf = async (date: string) => {
    const [row] = await t.db.query('SELECT scheduled_departure AS d, state FROM flights WHERE flight_number = ? AND service_date = ?', [SCHEDULED, date]);
    return row as { d: Date; state: string } | undefined;
  };

  it('generates its dated flights at the same local time on both sides of the spring clock change', async () => {
    // Mondays 1 to 22 March 2027 at 09:00 Boston time: EST (14:00 UTC) until 14 March, EDT (13:00 UTC) after.
    const res = await admin.post(`/api/stations/${bos}/schedules`, { carrierCode: 'ZZ', flightNumber: SCHEDULED, destination: 'ORD', departureTime: '09:00', blockMinutes: 160, seatsByCabin: { Y: 150 }, weekdays: [1], validFrom: '2027-03-01', validTo: '2027-03-22' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const out = scheduleResultSchema.parse(res.body);
    scheduleId = out.schedule.id;
    expect(out.created).toBe(4);
    expect(out.schedule.flights).toBe(4);
    expect((await depOf('2027-03-08'))?.d.toISOString()).toBe('2027-03-08T14:00:00.000Z');
    expect((await depOf('2027-03-15'))?.d.toISOString()).toBe('2027-03-15T13:00:00.000Z');
    const audits = await t.db.getRepository(AuditLogEntity).findBy({ action: 'schedule.created', entityId: String(scheduleId) });
    expect(audits).toHaveLength(1);
  });

  it('refuses a range that ends before it starts, or a weekday out of 1-7, naming the field', async () => {
    const bad = await admin.post(`/api/stations/${bos}/schedules`, { carrierCode: 'ZZ', flightNumber: '9Y', destination: 'ORD', departureTime: '09:00', blockMinutes: 160, seatsByCabin: { Y: 150 }, weekdays: [8], validFrom: '2027-03-10', validTo: '2027-03-01' });
    expect(bad.status).toBe(400);
    expect(bad.body.details.map((d: { field: string }) => d.field)).toEqual(expect.arrayContaining(['weekdays.0']));
  });

  it('moves its unsold flights when edited, and adds and drops days to match the new weekdays', async () => {
    // A passenger on 8 March: that day stays although the schedule no longer flies Mondays.
    const [{ id: f8 }] = await t.db.query('SELECT id FROM flights WHERE flight_number = ? AND service_date = ?', [SCHEDULED, '2027-03-08']);
    const booking = await t.db.query('INSERT INTO bookings (flight_id, pnr) VALUES (?, ?) RETURNING id', [f8, `SCH${SCHEDULED}`]);
    await t.db.query(
      "INSERT INTO passengers (booking_id, flight_id, pnr_sequence, first_name, last_name, cabin, fare_minor, fare_currency, ssr_codes) VALUES (?, ?, 1, 'Invented', 'Traveller', 'Y', 15000, 'USD', '[]')",
      [booking[0].id, f8],
    );
    const res = await admin.patch(`/api/schedules/${scheduleId}`, { weekdays: [2], departureTime: '10:30' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const out = scheduleResultSchema.parse(res.body);
    // Tuesdays 2, 9, 16 March 2027 are new; the Mondays without passengers go.
    expect(out.created).toBe(3);
    expect((await depOf('2027-03-09'))?.d.toISOString()).toBe('2027-03-09T15:30:00.000Z');
    expect((await depOf('2027-03-01'))?.state).toBe('cancelled');
    expect((await depOf('2027-03-08'))?.state).toBe('scheduled');
    expect(out.skipped.map((s) => s.date)).toEqual(['2027-03-08']);
  });

  it('cancels its unsold flights when cancelled, and is another station\'s "not found"', async () => {
    const res = await admin.post(`/api/schedules/${scheduleId}/cancel`);
    expect(res.status).toBe(200);
    expect(res.body.schedule.cancelled).toBe(true);
    expect((await depOf('2027-03-16'))?.state).toBe('cancelled');
    expect((await admin.patch(`/api/schedules/${scheduleId}`, { departureTime: '11:00' })).status).toBe(409);
    const [{ id: otherId }] = await t.db.query("INSERT INTO flight_schedules (station_id, carrier_code, flight_number, destination, departure_time, block_minutes, seats_by_cabin, weekdays, valid_from, valid_to) VALUES (?, 'ZZ', ?, 'OSL', '07:00', 90, '{\"Y\":100}', '[1]', '2027-01-01', '2027-01-02') RETURNING id", [foreign, SCHEDULED]);
    expect((await admin.patch(`/api/schedules/${otherId}`, { departureTime: '11:00' })).status).toBe(404);
    expect((await admin.get(`/api/stations/${foreign}/schedules`)).status).toBe(404);
  });
});
