// Refreshing the demo replaces its flights without leaving anything pointing at a flight that is gone, and without
// deleting a single money row: a flight a compensation stands on stays, with its round, volunteer and passengers.
// Runs in a database of its own, since a refresh rewrites every flight.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { findOrphans } from '../../server/src/db/migrations/1796290000000-ForeignKeys';
import { loadDemo, refreshDemoFlights } from '../../server/src/demo/load-demo';
import { startTestApp, type TestApp } from './harness';
import { scratchDatabase, type ScratchDatabase } from './scratch-db-helpers';

let t: TestApp;
let scratch: ScratchDatabase;
let db: DataSource;

beforeAll(async () => {
  t = await startTestApp();
  scratch = await scratchDatabase(t.db, 'demo');
  db = scratch.db;
  await db.runMigrations({ transaction: 'each' });
  await loadDemo(db, new Date('2026-03-02T12:00:00Z'));
}, 180_000);

afterAll(async () => {
  await scratch?.drop();
  await t.close();
});

async function count(sql: string, params: unknown[] = []): Promise<number> {
  const [{ n }] = await db.query(sql, params);
  return Number(n);
}

/** A round with one accepted volunteer on the flight, and (when paid) the compensation the accept writes. */
async function roundOn(flightId: number, paid: boolean) {
  const [flight] = await db.query('SELECT station_id FROM flights WHERE id = ?', [flightId]);
  const [pax] = await db.query('SELECT id, booking_id FROM passengers WHERE flight_id = ? ORDER BY id LIMIT 1', [flightId]);
  const [{ id: userId }] = await db.query(`SELECT id FROM users WHERE email = 'agent@bumpboard.test'`);
  const round = await db.query(
    `INSERT INTO volunteer_rounds (flight_id, station_id, kind, currency, extras, volunteers_needed, opened_by_user_id, opened_by_label)
     VALUES (?, ?, 'posted', 'USD', '{}', 1, ?, 'refresh test')`, [flightId, flight.station_id, userId],
  );
  await db.query(`INSERT INTO offer_approvals (round_id, station_id, offer_minor, requested_by_user_id, requested_by_label) VALUES (?, ?, 90000, ?, 'refresh test')`, [round.insertId, flight.station_id, userId]);
  const volunteer = await db.query(
    `INSERT INTO volunteers (round_id, flight_id, booking_id, passenger_ids, source, status) VALUES (?, ?, ?, ?, 'desk', 'accepted')`,
    [round.insertId, flightId, pax.booking_id, JSON.stringify([pax.id])],
  );
  await db.query(`INSERT INTO outbox_messages (id, station_id, flight_id, passenger_ids, kind, to_address, subject, text, next_attempt_at, created_at)
    VALUES (UUID(), ?, ?, ?, 'volunteer-confirmation', 'pax@example.test', 'Confirmation', 'Text', NOW(3), NOW(3))`, [flight.station_id, flightId, JSON.stringify([pax.id])]);
  if (!paid) return;
  await db.query(
    `INSERT INTO compensations (station_id, flight_id, booking_id, passenger_id, source_kind, source_id, regime, voluntary, amount_minor, currency, explanation)
     VALUES (?, ?, ?, ?, 'volunteer', ?, 'us-dot', 1, 20000, 'USD', 'refresh test')`,
    [flight.station_id, flightId, pax.booking_id, pax.id, volunteer.insertId],
  );
}

describe('refreshing the demo', () => {
  it('deletes old flights after what hangs off them, keeps the ones money stands on, and leaves no orphan', async () => {
    const flights: { id: number }[] = await db.query('SELECT id FROM flights ORDER BY id');
    expect(flights.length).toBeGreaterThan(3);
    const [paidFlight, unpaidFlight] = [flights[0].id, flights[1].id];
    await roundOn(paidFlight, true);
    await roundOn(unpaidFlight, false);
    await db.query(`INSERT INTO flight_events (station_id, event_id, flight_id, type, occurred_at, status, summary, payload)
      SELECT station_id, 'refresh-test-1', id, 'passenger.checked-in', NOW(3), 'applied', 'test', '{}' FROM flights WHERE id = ?`, [unpaidFlight]);
    const moneyBefore = await count('SELECT COUNT(*) AS n FROM compensations');

    // A day later: every demo flight has left.
    await refreshDemoFlights(db, new Date('2026-03-03T12:00:00Z'));

    expect(await count('SELECT COUNT(*) AS n FROM compensations')).toBe(moneyBefore);
    expect(await count('SELECT COUNT(*) AS n FROM flights WHERE id = ?', [paidFlight])).toBe(1);
    expect(await count('SELECT COUNT(*) AS n FROM volunteers WHERE flight_id = ?', [paidFlight])).toBe(1);
    expect(await count('SELECT COUNT(*) AS n FROM flights WHERE id = ?', [unpaidFlight])).toBe(0);
    expect(await count('SELECT COUNT(*) AS n FROM volunteer_rounds WHERE flight_id = ?', [unpaidFlight])).toBe(0);
    expect(await count('SELECT COUNT(*) AS n FROM flights WHERE id > ?', [flights[flights.length - 1].id])).toBe(flights.length);
    const orphans = await findOrphans(db.createQueryRunner());
    expect(orphans.map((o) => `${o.ref.table}.${o.ref.column}`)).toEqual([]);
    const [row] = await db.query(`SELECT JSON_EXTRACT(\`after\`, '$.deleted.volunteer_rounds') AS rounds FROM audit_log WHERE action = 'demo.refreshed'`);
    expect(Number(row.rounds)).toBe(1);
  }, 180_000);
});
