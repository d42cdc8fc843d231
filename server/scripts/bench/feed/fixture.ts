// The bench's data: enough flights (copies of demo flights with their manifests), one feed key per station, and the
// passengers each flight's events will move. Reads and writes the bench database directly, never the app's.
import type { DataSource, EntityManager } from 'typeorm';
import { createIntegrationKey } from '../../../src/modules/integrations/integration-keys.service';

export interface BenchPassenger {
  pnr: string;
  sequence: number;
  /** The bench's own model of the passenger: true once the last event it sent says "checked in". */
  checkedIn: boolean;
}

export interface BenchFlight {
  id: number;
  stationId: number;
  carrier: string;
  number: string;
  date: string;
  passengers: BenchPassenger[];
  /** Checked-in passengers the events never touch (on a cancelled booking, say): part of every expected count. */
  untouchedCheckedIn: number;
}

/** What the flight's checked-in count must be, given the events the bench has sent. */
export const expectedCheckedIn = (f: BenchFlight) => f.untouchedCheckedIn + f.passengers.filter((p) => p.checkedIn).length;

/** Flight numbers of the copies, far from the demo's own (1-4 digits, as the feed schema requires). */
const COPY_NUMBER_BASE = 9900;

/** Statuses that count as "checked in" on the flight desk (a boarded passenger has checked in). */
const CHECKED_IN_SQL = `p.status IN ('checked-in', 'boarded')`;

async function copyableColumns(em: EntityManager, table: string, exclude: string[]): Promise<string[]> {
  // Listed from the live schema so that a column added by a later migration is copied too.
  const rows: { name: string }[] = await em.query(
    `SELECT COLUMN_NAME AS name FROM information_schema.COLUMNS
     WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? AND EXTRA NOT LIKE '%GENERATED%' ORDER BY ORDINAL_POSITION`,
    [table],
  );
  return rows.map((r) => r.name).filter((n) => !exclude.includes(n));
}

const list = (columns: string[], alias = '') => columns.map((c) => `${alias}\`${c}\``).join(', ');

/** Copies one flight with its bookings and passengers under a new flight number; returns the new flight's id. */
async function copyFlight(em: EntityManager, sourceId: number, newNumber: string): Promise<number> {
  const flightCols = await copyableColumns(em, 'flights', ['id', 'flight_number', 'created_at']);
  await em.query(`INSERT INTO flights (${list(flightCols)}, flight_number) SELECT ${list(flightCols)}, ? FROM flights WHERE id = ?`, [newNumber, sourceId]);
  const [created]: { id: number }[] = await em.query(
    `SELECT f.id FROM flights f JOIN flights s ON s.id = ? WHERE f.carrier_code = s.carrier_code AND f.flight_number = ? AND f.service_date = s.service_date AND f.origin = s.origin`,
    [sourceId, newNumber],
  );
  const bookingCols = await copyableColumns(em, 'bookings', ['id', 'flight_id']);
  await em.query(`INSERT INTO bookings (flight_id, ${list(bookingCols)}) SELECT ?, ${list(bookingCols)} FROM bookings WHERE flight_id = ?`, [created.id, sourceId]);
  const passengerCols = await copyableColumns(em, 'passengers', ['id', 'booking_id', 'flight_id']);
  await em.query(
    `INSERT INTO passengers (booking_id, flight_id, ${list(passengerCols)})
     SELECT nb.id, ?, ${list(passengerCols, 'p.')} FROM passengers p
     JOIN bookings ob ON ob.id = p.booking_id
     JOIN bookings nb ON nb.flight_id = ? AND nb.pnr = ob.pnr
     WHERE p.flight_id = ?`,
    [created.id, created.id, sourceId],
  );
  return created.id;
}

/**
 * Makes sure the database holds at least `wanted` flights, copying the fullest flights that have not left yet.
 * Returns the ids of the flights the bench drives: those not yet departed first, then the rest, by id.
 */
export async function ensureFlights(db: DataSource, wanted: number): Promise<number[]> {
  const order = `ORDER BY (f.scheduled_departure > UTC_TIMESTAMP()) DESC, f.id`;
  const existing: { id: number }[] = await db.query(`SELECT f.id FROM flights f ${order}`);
  if (existing.length < wanted) {
    const sources: { id: number }[] = await db.query(
      `SELECT f.id FROM flights f JOIN passengers p ON p.flight_id = f.id
       WHERE f.scheduled_departure > UTC_TIMESTAMP() AND f.flight_number NOT LIKE '99__'
       GROUP BY f.id ORDER BY COUNT(*) DESC, f.id`,
    );
    if (!sources.length) throw new Error('the bench database has no future flight with passengers to copy; load the demo first');
    await db.transaction(async (em) => {
      for (let i = 0; i < wanted - existing.length; i++) await copyFlight(em, sources[i % sources.length].id, String(COPY_NUMBER_BASE + i));
    });
  }
  const all: { id: number }[] = await db.query(`SELECT f.id FROM flights f ${order}`);
  return all.slice(0, wanted).map((r) => Number(r.id));
}

/** The flights with every passenger an event may move (not cancelled, on an active booking). */
export async function loadBenchFlights(db: DataSource, flightIds: number[]): Promise<BenchFlight[]> {
  const flights: { id: number; station_id: number; carrier_code: string; flight_number: string; service_date: string | Date }[] = await db.query(
    `SELECT id, station_id, carrier_code, flight_number, DATE_FORMAT(service_date, '%Y-%m-%d') AS service_date FROM flights WHERE id IN (?)`,
    [flightIds],
  );
  const people: { flight_id: number; pnr: string; pnr_sequence: number; checked_in: number | string }[] = await db.query(
    `SELECT p.flight_id, b.pnr, p.pnr_sequence, ${CHECKED_IN_SQL} AS checked_in FROM passengers p JOIN bookings b ON b.id = p.booking_id
     WHERE p.flight_id IN (?) AND p.status <> 'cancelled' AND b.status = 'active' ORDER BY p.flight_id, p.id`,
    [flightIds],
  );
  const stored = await storedCheckedIn(db, flightIds);
  return flightIds.map((id) => {
    const f = flights.find((x) => Number(x.id) === id);
    if (!f) throw new Error(`flight ${id} vanished from the bench database`);
    const passengers = people.filter((p) => Number(p.flight_id) === id).map((p) => ({ pnr: p.pnr, sequence: Number(p.pnr_sequence), checkedIn: Number(p.checked_in) === 1 }));
    const untouchedCheckedIn = (stored.get(id) ?? 0) - passengers.filter((p) => p.checkedIn).length;
    return { id, stationId: Number(f.station_id), carrier: f.carrier_code, number: f.flight_number, date: String(f.service_date), passengers, untouchedCheckedIn };
  });
}

/** A fresh feed key for each station, made by the same service an admin uses. */
export async function createStationKeys(db: DataSource, stationIds: number[]): Promise<Map<number, string>> {
  const keys = new Map<number, string>();
  for (const stationId of new Set(stationIds)) keys.set(stationId, (await createIntegrationKey(db, stationId, 'Bench feed', { label: 'feed latency bench' })).key);
  return keys;
}

/** Checked-in passengers per flight as stored, to compare with what the bench's events should have produced. */
export async function storedCheckedIn(db: DataSource, flightIds: number[]): Promise<Map<number, number>> {
  const rows: { flight_id: number; n: number | string }[] = await db.query(
    `SELECT p.flight_id, SUM(${CHECKED_IN_SQL}) AS n FROM passengers p WHERE p.flight_id IN (?) GROUP BY p.flight_id`,
    [flightIds],
  );
  return new Map(rows.map((r) => [Number(r.flight_id), Number(r.n)]));
}

/** When the figures a flight's consoles were last told about were computed (the recompute's start). */
export async function forecastComputedAt(db: DataSource, flightId: number): Promise<number | null> {
  const rows: { computed_at: Date }[] = await db.query('SELECT computed_at FROM flight_forecasts WHERE flight_id = ?', [flightId]);
  return rows.length ? new Date(rows[0].computed_at).getTime() : null;
}
