// Foreign keys on every reference between tables, after a check that reports every orphan and changes nothing
// while any remain: orphans are never deleted here, since some of them may be money.
//
// Rule: a reference across records RESTRICTs a delete, so a flight, passenger, round or denial cannot vanish from
// under the volunteers, denials, compensations and payments that point at it, and a money row holds its whole chain.
// Only a record's own parts CASCADE with it: a booking and its passengers with their flight, the derived forecast
// figures with their flight, a reconciliation run's differences with the run, a user's station links with the user.
// The list is frozen with this migration; a later table adds its keys in its own migration (the schema test fails
// on any integer `*_id` column without one).
import type { MigrationInterface, QueryRunner } from 'typeorm';

export interface Reference {
  table: string;
  column: string;
  parent: string;
  onDelete: 'RESTRICT' | 'CASCADE';
}

const r = (table: string, column: string, parent: string, onDelete: Reference['onDelete'] = 'RESTRICT'): Reference => ({ table, column, parent, onDelete });

export const REFERENCES: Reference[] = [
  r('flights', 'station_id', 'stations'),
  r('bookings', 'flight_id', 'flights', 'CASCADE'),
  r('passengers', 'booking_id', 'bookings', 'CASCADE'),
  r('passengers', 'flight_id', 'flights', 'CASCADE'),
  r('user_stations', 'user_id', 'users', 'CASCADE'),
  r('user_stations', 'station_id', 'stations', 'CASCADE'),
  r('flight_forecasts', 'flight_id', 'flights', 'CASCADE'),
  r('forecast_snapshots', 'flight_id', 'flights', 'CASCADE'),
  r('flight_events', 'flight_id', 'flights'),
  r('flight_events', 'station_id', 'stations'),
  r('integration_keys', 'station_id', 'stations'),
  r('integration_keys', 'created_by_user_id', 'users'),
  r('show_up_profiles', 'station_id', 'stations'),
  r('show_up_profiles', 'updated_by_user_id', 'users'),
  r('volunteer_policies', 'station_id', 'stations'),
  r('station_priority_rules', 'station_id', 'stations'),
  r('saved_plans', 'station_id', 'stations'),
  r('saved_plans', 'created_by_user_id', 'users'),
  r('outbox_messages', 'station_id', 'stations'),
  r('outbox_messages', 'flight_id', 'flights'),
  r('volunteer_rounds', 'flight_id', 'flights'),
  r('volunteer_rounds', 'station_id', 'stations'),
  r('volunteer_rounds', 'opened_by_user_id', 'users'),
  r('offer_approvals', 'round_id', 'volunteer_rounds'),
  r('offer_approvals', 'station_id', 'stations'),
  r('offer_approvals', 'requested_by_user_id', 'users'),
  r('offer_approvals', 'decided_by_user_id', 'users'),
  r('volunteers', 'round_id', 'volunteer_rounds'),
  r('volunteers', 'flight_id', 'flights'),
  r('volunteers', 'booking_id', 'bookings'),
  r('volunteers', 'accepted_by_user_id', 'users'),
  r('rebookings', 'volunteer_id', 'volunteers'),
  r('rebookings', 'denial_id', 'denials'),
  r('rebookings', 'original_flight_id', 'flights'),
  r('rebookings', 'alternate_flight_id', 'flights'),
  r('rebookings', 'created_by_user_id', 'users'),
  r('denial_proposals', 'flight_id', 'flights'),
  r('denial_proposals', 'station_id', 'stations'),
  r('denial_proposals', 'proposed_by_user_id', 'users'),
  r('denial_proposals', 'decided_by_user_id', 'users'),
  r('denials', 'proposal_id', 'denial_proposals'),
  r('denials', 'flight_id', 'flights'),
  r('denials', 'station_id', 'stations'),
  r('denials', 'booking_id', 'bookings'),
  r('denials', 'selected_by_user_id', 'users'),
  r('denials', 'authorized_by_user_id', 'users'),
  r('compensations', 'station_id', 'stations'),
  r('compensations', 'flight_id', 'flights'),
  r('compensations', 'booking_id', 'bookings'),
  r('compensations', 'passenger_id', 'passengers'),
  // `source_id` names a volunteer or a denial by `source_kind`, so it cannot be one key; the passenger, booking and
  // flight keys above hold the compensation to its chain.
  r('payment_issuances', 'compensation_id', 'compensations'),
  r('voucher_offers', 'compensation_id', 'compensations'),
  r('voucher_offers', 'offered_by_user_id', 'users'),
  r('voucher_offers', 'agreed_recorded_by_user_id', 'users'),
  r('reconciliation_runs', 'started_by_user_id', 'users'),
  r('reconciliation_differences', 'run_id', 'reconciliation_runs', 'CASCADE'),
  r('reconciliation_differences', 'resolved_by_user_id', 'users'),
  // `subject_id` names a round, a volunteer, a compensation or a denial by `kind`, so it cannot be one key.
  r('offer_approvals', 'flight_id', 'flights'),
  r('cabin_changes', 'station_id', 'stations'),
  r('cabin_changes', 'flight_id', 'flights'),
  r('cabin_changes', 'passenger_id', 'passengers'),
  r('cabin_changes', 'recorded_by_user_id', 'users'),
  r('alerts', 'station_id', 'stations'),
  r('alerts', 'flight_id', 'flights'),
  r('alerts', 'compensation_id', 'compensations'),
  r('alerts', 'acknowledged_by_user_id', 'users'),
  r('boarding_refusals', 'flight_id', 'flights'),
  r('boarding_refusals', 'station_id', 'stations'),
  r('boarding_refusals', 'booking_id', 'bookings'),
  r('boarding_refusals', 'refused_by_user_id', 'users'),
];



const name = (ref: Reference) => `fk_${ref.table}_${ref.column}`.slice(0, 64);

export interface Orphans {
  ref: Reference;
  count: number;
  sample: string[];
}

async function columnExists(q: QueryRunner, table: string, column: string): Promise<boolean> {
  const rows: unknown[] = await q.query(
    'SELECT 1 FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? AND COLUMN_NAME = ?',
    [table, column],
  );
  return rows.length > 0;
}

/** Rows whose reference points at nothing, per reference, with up to ten primary keys of each to look at. */
export async function findOrphans(q: QueryRunner, refs: Reference[] = REFERENCES): Promise<Orphans[]> {
  const found: Orphans[] = [];
  for (const ref of refs) {
    if (!(await columnExists(q, ref.table, ref.column))) continue;
    const [pk] = (await q.query(
      `SELECT GROUP_CONCAT(COLUMN_NAME ORDER BY ORDINAL_POSITION) AS cols FROM information_schema.KEY_COLUMN_USAGE
       WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? AND CONSTRAINT_NAME = 'PRIMARY'`,
      [ref.table],
    )) as { cols: string | null }[];
    const key = (pk.cols ?? ref.column).split(',').map((c) => `c.\`${c}\``).join(", '/', ");
    const from = `FROM \`${ref.table}\` c LEFT JOIN \`${ref.parent}\` p ON p.id = c.\`${ref.column}\` WHERE c.\`${ref.column}\` IS NOT NULL AND p.id IS NULL`;
    const [{ n }] = (await q.query(`SELECT COUNT(*) AS n ${from}`)) as { n: number | string }[];
    if (Number(n) === 0) continue;
    const sample = ((await q.query(`SELECT CONCAT(${key}) AS k, c.\`${ref.column}\` AS v ${from} LIMIT 10`)) as { k: string; v: number }[])
      .map((row) => `${row.k} → ${ref.parent} ${row.v}`);
    found.push({ ref, count: Number(n), sample });
  }
  return found;
}

export function describeOrphans(orphans: Orphans[]): string {
  const lines = orphans.map((o) => `  ${o.ref.table}.${o.ref.column} → ${o.ref.parent}: ${o.count} row(s), e.g. ${o.sample.join('; ')}`);
  return [
    'Foreign keys not added: these rows point at records that no longer exist. Nothing was changed or deleted.',
    ...lines,
    'Restore the missing records, or settle each row with finance and compliance staff, then run the migrations again.',
  ].join('\n');
}

interface ExistingKey {
  name: string;
  parent: string;
  onDelete: string;
}

async function existingKey(q: QueryRunner, ref: Reference): Promise<ExistingKey | null> {
  const rows: { name: string; parent: string; on_delete: string }[] = await q.query(
    `SELECT k.CONSTRAINT_NAME AS name, k.REFERENCED_TABLE_NAME AS parent, rc.DELETE_RULE AS on_delete
     FROM information_schema.KEY_COLUMN_USAGE k
     JOIN information_schema.REFERENTIAL_CONSTRAINTS rc ON rc.CONSTRAINT_SCHEMA = k.CONSTRAINT_SCHEMA AND rc.CONSTRAINT_NAME = k.CONSTRAINT_NAME
     WHERE k.TABLE_SCHEMA = DATABASE() AND k.TABLE_NAME = ? AND k.COLUMN_NAME = ? AND k.REFERENCED_TABLE_NAME IS NOT NULL`,
    [ref.table, ref.column],
  );
  return rows[0] ? { name: rows[0].name, parent: rows[0].parent, onDelete: rows[0].on_delete } : null;
}

// MariaDB reports RESTRICT and NO ACTION alike for InnoDB: both refuse the delete at once.
const sameRule = (a: string, b: string) => a === b || (a !== 'CASCADE' && b !== 'CASCADE' && a !== 'SET NULL' && b !== 'SET NULL');

export class ForeignKeys1796290000000 implements MigrationInterface {
  name = 'ForeignKeys1796290000000';

  public async up(q: QueryRunner): Promise<void> {
    const orphans = await findOrphans(q);
    if (orphans.length) throw new Error(describeOrphans(orphans));
    for (const ref of REFERENCES) {
      // A table another change renamed or dropped is that change's to key; the schema test names what is left bare.
      if (!(await columnExists(q, ref.table, ref.column))) continue;
      const existing = await existingKey(q, ref);
      if (existing && existing.parent === ref.parent && sameRule(existing.onDelete, ref.onDelete)) continue;
      if (existing) await q.query(`ALTER TABLE \`${ref.table}\` DROP FOREIGN KEY \`${existing.name}\``);
      await q.query(
        `ALTER TABLE \`${ref.table}\` ADD CONSTRAINT \`${name(ref)}\` FOREIGN KEY (\`${ref.column}\`) REFERENCES \`${ref.parent}\`(\`id\`) ON DELETE ${ref.onDelete} ON UPDATE RESTRICT`,
      );
    }
  }

  public async down(q: QueryRunner): Promise<void> {
    for (const ref of [...REFERENCES].reverse()) {
      const existing = await existingKey(q, ref);
      if (existing?.name === name(ref)) await q.query(`ALTER TABLE \`${ref.table}\` DROP FOREIGN KEY \`${existing.name}\``);
    }
    // The one earlier key this migration replaced, as the outbox migration made it.
    if (!(await existingKey(q, { table: 'outbox_messages', column: 'flight_id', parent: 'flights', onDelete: 'CASCADE' }))) {
      await q.query('ALTER TABLE `outbox_messages` ADD CONSTRAINT `fk_outbox_flight` FOREIGN KEY (`flight_id`) REFERENCES `flights`(`id`) ON DELETE CASCADE ON UPDATE NO ACTION');
    }
  }
}
