// The data holds together: every reference between tables is a foreign key, a delete that would orphan a round,
// volunteer, denial or compensation is refused, and the migration that adds the keys reports orphans it finds and
// changes nothing rather than deleting them.
// Outside sources: MariaDB documentation "Foreign Keys" (RESTRICT and NO ACTION refuse the parent delete at once;
// error 1451 ER_ROW_IS_REFERENCED_2) and "information_schema.REFERENTIAL_CONSTRAINTS", from memory.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { migrations } from '../../server/src/db/migrations';
import { ForeignKeys1796290000000 } from '../../server/src/db/migrations/1796290000000-ForeignKeys';
import { startTestApp, type TestApp } from './harness';
import { stationIdByIata } from './helpers';
import { scratchDatabase, type ScratchDatabase } from './scratch-db-helpers';
import { addBooking, makeFlight } from './volunteers-fixtures';

/**
 * Integer `*_id` columns that are deliberately not keys, with the reason. The audit log records who and what by
 * value and must outlive anything it names (and accept actors such as the demo loader).
 */
const NOT_REFERENCES: Record<string, string> = {
  'audit_log.actor_user_id': 'the append-only log keeps the actor by value, with the label beside it',
  'audit_log.station_id': 'the append-only log keeps the station by value',
  'compensations.source_id': 'a volunteer or a denial by source_kind; the passenger, booking and flight keys hold the row',
  'offer_approvals.subject_id': 'a round, volunteer, compensation or denial by kind; the flight and station keys hold the row',
  // The provider's word, kept even when it names no ledger row: that is exactly what reconciliation must report.
  'provider_cards.compensation_id': 'mirrors the card metadata at the payment provider',
  'provider_events.compensation_id': 'mirrors the event received from the payment provider',
  'reconciliation_differences.compensation_id': 'a difference may name a compensation the ledger does not hold',
  // The learning history outlives the operational rows it was taken from (the demo replaces its flights every day).
  'closed_flights.flight_id': 'a closed flight keeps the flight it was recorded from by value',
  'booking_outcomes.passenger_id': 'an outcome keeps the passenger it was recorded from by value',
};

/** A record's own parts, which go with it; every other reference refuses the delete. */
const OWNED_PARTS = new Set([
  'bookings.flight_id', 'passengers.booking_id', 'passengers.flight_id', 'flight_forecasts.flight_id', 'forecast_snapshots.flight_id',
  'reconciliation_differences.run_id', 'user_stations.user_id', 'user_stations.station_id', 'booking_outcomes.closed_flight_id',
  // An alert about waiting work only points at it (the audit log keeps the history), so it goes with its subject.
  'alerts.volunteer_id', 'alerts.approval_id', 'alerts.denial_proposal_id',
  'forecast_recompute_queue.flight_id',
]);

/** References that let go of the row rather than refuse the delete, with the reason. */
const DETACHED_ON_DELETE: Record<string, string> = {
  'flights.schedule_id': 'a flight outlives the weekly schedule that made it; only the link goes',
};

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

interface KeyRow { tbl: string; col: string; parent: string | null; on_delete: string | null }

async function idColumns(db: DataSource): Promise<KeyRow[]> {
  return db.query(
    `SELECT c.TABLE_NAME AS tbl, c.COLUMN_NAME AS col, k.REFERENCED_TABLE_NAME AS parent, rc.DELETE_RULE AS on_delete
     FROM information_schema.COLUMNS c
     LEFT JOIN information_schema.KEY_COLUMN_USAGE k ON k.TABLE_SCHEMA = c.TABLE_SCHEMA AND k.TABLE_NAME = c.TABLE_NAME
       AND k.COLUMN_NAME = c.COLUMN_NAME AND k.REFERENCED_TABLE_NAME IS NOT NULL
     LEFT JOIN information_schema.REFERENTIAL_CONSTRAINTS rc ON rc.CONSTRAINT_SCHEMA = k.CONSTRAINT_SCHEMA AND rc.CONSTRAINT_NAME = k.CONSTRAINT_NAME
     WHERE c.TABLE_SCHEMA = DATABASE() AND c.COLUMN_NAME LIKE '%\\_id' AND c.DATA_TYPE IN ('int', 'bigint', 'smallint')
       AND c.TABLE_NAME NOT IN ('migrations', 'sessions')`,
  );
}

describe('every reference is a foreign key', () => {
  it('no integer *_id column is left without one, except the few kept by value for a stated reason', async () => {
    const rows = await idColumns(t.db);
    expect(rows.length).toBeGreaterThan(50);
    const bare = rows.filter((r) => !r.parent && !NOT_REFERENCES[`${r.tbl}.${r.col}`]).map((r) => `${r.tbl}.${r.col}`);
    expect(bare).toEqual([]);
  });

  it('only a record’s own parts cascade; every other reference refuses the delete', async () => {
    const cascading = (await idColumns(t.db)).filter((r) => r.on_delete && r.on_delete !== 'RESTRICT' && r.on_delete !== 'NO ACTION');
    expect(cascading.filter((r) => !OWNED_PARTS.has(`${r.tbl}.${r.col}`) && !(r.on_delete === 'SET NULL' && DETACHED_ON_DELETE[`${r.tbl}.${r.col}`])).map((r) => `${r.tbl}.${r.col} ${r.on_delete}`)).toEqual([]);
  });
});

describe('deletes that would orphan operational or money rows are refused', () => {
  it('a flight with a volunteer round, and a passenger with a compensation, cannot be deleted', async () => {
    const bos = await stationIdByIata(t.db, 'BOS');
    const flight = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'BTV' });
    const { booking, passengers } = await addBooking(t.db, flight, [['Ada', 'Keyholder']]);
    const [{ id: userId }] = await t.db.query(`SELECT id FROM users WHERE email = 'agent@bumpboard.test'`);
    const round = await t.db.query(
      `INSERT INTO volunteer_rounds (flight_id, station_id, kind, currency, extras, volunteers_needed, opened_by_user_id, opened_by_label)
       VALUES (?, ?, 'posted', 'USD', '{}', 1, ?, 'schema test')`, [flight.id, bos, userId],
    );
    const volunteer = await t.db.query(
      `INSERT INTO volunteers (round_id, flight_id, booking_id, passenger_ids, source, status) VALUES (?, ?, ?, ?, 'desk', 'accepted')`,
      [round.insertId, flight.id, booking.id, JSON.stringify([passengers[0].id])],
    );
    const comp = await t.db.query(
      `INSERT INTO compensations (station_id, flight_id, booking_id, passenger_id, source_kind, source_id, regime, voluntary, amount_minor, currency, explanation)
       VALUES (?, ?, ?, ?, 'volunteer', ?, 'us-dot', 1, 20000, 'USD', 'schema test')`,
      [bos, flight.id, booking.id, passengers[0].id, volunteer.insertId],
    );
    await expect(t.db.query('DELETE FROM flights WHERE id = ?', [flight.id])).rejects.toThrow(/foreign key constraint fails/);
    await expect(t.db.query('DELETE FROM passengers WHERE id = ?', [passengers[0].id])).rejects.toThrow(/foreign key constraint fails/);
    await expect(t.db.query('DELETE FROM volunteer_rounds WHERE id = ?', [round.insertId])).rejects.toThrow(/foreign key constraint fails/);
    // A compensation cannot name a passenger that does not exist.
    await expect(t.db.query(
      `INSERT INTO compensations (station_id, flight_id, booking_id, passenger_id, source_kind, source_id, regime, voluntary, amount_minor, currency, explanation)
       VALUES (?, ?, ?, 2147483000, 'volunteer', ?, 'us-dot', 1, 20000, 'USD', 'schema test')`, [bos, flight.id, booking.id, volunteer.insertId],
    )).rejects.toThrow(/foreign key constraint fails/);
    const [{ n }] = await t.db.query('SELECT COUNT(*) AS n FROM compensations WHERE id = ?', [comp.insertId]);
    expect(Number(n)).toBe(1);
    // Test rows only: this test's own chain, child first, in the order the keys demand.
    await t.db.query('DELETE FROM compensations WHERE id = ?', [comp.insertId]);
    await t.db.query('DELETE FROM volunteers WHERE id = ?', [volunteer.insertId]);
    await t.db.query('DELETE FROM volunteer_rounds WHERE id = ?', [round.insertId]);
    await t.db.query('DELETE FROM flights WHERE id = ?', [flight.id]);
  });
});

describe('the migration that adds the keys', () => {
  let scratch: ScratchDatabase;
  let db: DataSource;

  beforeAll(async () => {
    scratch = await scratchDatabase(t.db, 'fk');
    db = scratch.db;
    // The schema as it was before the keys: every earlier migration, and not this one.
    const earlier = migrations.filter((m) => m !== ForeignKeys1796290000000).map((M) => new M());
    const runner = db.createQueryRunner();
    for (const m of earlier) await m.up(runner);
    await runner.release();
  }, 120_000);

  afterAll(async () => {
    await scratch?.drop();
  });

  it('lists every orphan with its keys, deletes none of them, and adds the keys once they are settled', async () => {
    await db.query(`INSERT INTO stations (id, iata, name, time_zone, regime, currency) VALUES (1, 'BOS', 'Boston', 'America/New_York', 'us-dot', 'USD')`);
    await db.query(
      `INSERT INTO volunteer_rounds (id, flight_id, station_id, kind, currency, extras, volunteers_needed, opened_by_user_id, opened_by_label)
       VALUES (41, 9001, 1, 'posted', 'USD', '{}', 1, 77, 'orphan')`,
    );
    await db.query(
      `INSERT INTO compensations (id, station_id, flight_id, booking_id, passenger_id, source_kind, source_id, regime, voluntary, amount_minor, currency, explanation)
       VALUES (52, 1, 9001, 9002, 9003, 'denial', 9004, 'us-dot', 0, 77500, 'USD', 'orphan')`,
    );
    const runner = db.createQueryRunner();
    try {
      const up = new ForeignKeys1796290000000().up(runner);
      await expect(up).rejects.toThrow(/Nothing was changed or deleted/);
      const message = await up.catch((e: Error) => e.message);
      expect(message).toContain('volunteer_rounds.flight_id → flights: 1 row(s), e.g. 41 → flights 9001');
      expect(message).toContain('volunteer_rounds.opened_by_user_id → users: 1 row(s), e.g. 41 → users 77');
      expect(message).toContain('compensations.passenger_id → passengers: 1 row(s), e.g. 52 → passengers 9003');
      expect(message).toContain('compensations.flight_id → flights: 1 row(s), e.g. 52 → flights 9001');
      const [{ n }] = await db.query('SELECT (SELECT COUNT(*) FROM compensations) + (SELECT COUNT(*) FROM volunteer_rounds) AS n');
      expect(Number(n)).toBe(2);
      const [{ n: keys }] = await db.query(`SELECT COUNT(*) AS n FROM information_schema.REFERENTIAL_CONSTRAINTS WHERE CONSTRAINT_SCHEMA = DATABASE() AND CONSTRAINT_NAME LIKE 'fk\\_volunteer%'`);
      expect(Number(keys)).toBe(0);

      // Settled by whoever owns the rows (here: the test that made them); then the keys go on.
      await db.query('DELETE FROM compensations WHERE id = 52');
      await db.query('DELETE FROM volunteer_rounds WHERE id = 41');
      await new ForeignKeys1796290000000().up(runner);
      const [{ added }] = await db.query(`SELECT COUNT(*) AS added FROM information_schema.REFERENTIAL_CONSTRAINTS WHERE CONSTRAINT_SCHEMA = DATABASE()`);
      expect(Number(added)).toBeGreaterThanOrEqual(50);
      // Running it again changes nothing (every key already there with its rule).
      await new ForeignKeys1796290000000().up(runner);
    } finally {
      await runner.release();
    }
  }, 120_000);
});
