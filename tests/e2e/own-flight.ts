// A spec's own oversold flight at BOS, and a later one on the same route with room for rebooking, written straight to
// the database the app uses and removed afterwards: no spec changes a demo flight that another spec (or a person
// trying the demo) is looking at.
import mysql from 'mysql2/promise';
import { expect } from '@playwright/test';
import { removeTestFlights } from './helpers';

const DATABASE_URL = process.env.DATABASE_URL ?? '';
const RUN = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

export interface OwnFlight {
  flightId: number;
  alternateId: number;
  /** As the desk's heading shows it, e.g. "ZZ 6123". */
  label: string;
  destination: string;
  remove(): Promise<void>;
}

async function insertFlight(db: mysql.Connection, stationId: number, number: string, departure: Date, seats: number): Promise<number> {
  const [res] = await db.execute<mysql.ResultSetHeader>(
    `INSERT INTO flights (station_id, carrier_code, flight_number, service_date, origin, destination, scheduled_departure, scheduled_arrival, aircraft_type, seats_by_cabin, gate, state)
     VALUES (?, 'ZZ', ?, ?, 'BOS', 'ORD', ?, ?, '320', ?, 'B7', 'check-in-open')`,
    [stationId, number, departure.toISOString().slice(0, 10), departure, new Date(departure.getTime() + 165 * 60_000), JSON.stringify({ Y: seats })],
  );
  return res.insertId;
}

/**
 * `checkedIn` solo travellers checked in on `seats` seats (default 33 on 30: three over), and `booked` more not yet
 * checked in, each with a booking of their own and a contact address under .test (RFC 2606); by default on a date far
 * ahead, so no departures board of today lists it.
 */
export async function ownFlight(tag: string, opts: { seats?: number; checkedIn?: number; booked?: number; departsInMinutes?: number } = {}): Promise<OwnFlight> {
  expect(DATABASE_URL, 'DATABASE_URL of the database the app uses').not.toBe('');
  const db = await mysql.createConnection({ uri: DATABASE_URL.replace(/^mariadb:/, 'mysql:'), timezone: 'Z' });
  try {
    const [[station]] = await db.query<mysql.RowDataPacket[]>(`SELECT id FROM stations WHERE iata = 'BOS'`);
    // Far ahead unless the spec needs check-in open now (the feed refuses check-ins long before departure).
    const departure = opts.departsInMinutes !== undefined
      ? new Date(Math.floor(Date.now() / 60_000) * 60_000 + opts.departsInMinutes * 60_000)
      : new Date(Date.now() + (100 + Math.floor(Math.random() * 600)) * 86_400_000);
    if (opts.departsInMinutes === undefined) departure.setUTCHours(14, 0, 0, 0);
    const number = String(6000 + Math.floor(Math.random() * 1000));
    const flightId = await insertFlight(db, station.id, number, departure, opts.seats ?? 30);
    const alternateId = await insertFlight(db, station.id, String(6000 + ((Number(number) - 6000 + 500) % 1000)), new Date(departure.getTime() + 3 * 3_600_000), 150);
    const checkedIn = opts.checkedIn ?? 33;
    // The first `checkedIn` have checked in; `booked` more have not yet (the feed can check them in).
    for (let i = 1; i <= checkedIn + (opts.booked ?? 0); i++) {
      const arrived = i <= checkedIn;
      const pnr = `F${RUN.slice(-3)}${String(i).padStart(2, '0')}`.toUpperCase().replace(/[^A-Z0-9]/g, 'X').slice(0, 6);
      const [booking] = await db.execute<mysql.ResultSetHeader>(`INSERT INTO bookings (flight_id, pnr, contact_email, travels_together, status) VALUES (?, ?, ?, 1, 'active')`,
        [flightId, pnr, `e2e-${tag}-${RUN}-${i}@passengers.bumpboard.test`]);
      const at = new Date(departure.getTime() - (240 - i) * 60_000);
      await db.execute(
        `INSERT INTO passengers (booking_id, flight_id, pnr_sequence, first_name, last_name, cabin, fare_minor, fare_currency, fare_type, ssr_codes, is_child, status, checked_in_at, status_changed_at)
         VALUES (?, ?, 1, ?, ?, 'Y', 24900, 'USD', 'standard', '[]', 0, ?, ?, ?)`,
        [booking.insertId, flightId, ['Ada', 'Bruno', 'Chloé', 'Dev', 'Eun-ji', 'Farah'][i % 6], `Traveller${i}`, arrived ? 'checked-in' : 'booked', arrived ? at : null, arrived ? at : null],
      );
    }
    return {
      flightId, alternateId, label: `ZZ ${number}`, destination: 'ORD',
      async remove() {
        const cleanup = await mysql.createConnection({ uri: DATABASE_URL.replace(/^mariadb:/, 'mysql:'), timezone: 'Z' });
        try {
          await removeTestFlights(cleanup, [flightId, alternateId]);
        } finally {
          await cleanup.end();
        }
      },
    };
  } finally {
    await db.end();
  }
}
