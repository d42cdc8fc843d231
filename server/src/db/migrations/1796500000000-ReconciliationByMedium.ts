import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Reconciliation compares each medium with its own record: each difference names its medium, and each run keeps a
 * summary per medium (ledger rows, the other side's records, differences, and what is outstanding).
 */
export class ReconciliationByMedium1796500000000 implements MigrationInterface {
  name = 'ReconciliationByMedium1796500000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `reconciliation_differences` ADD `medium` varchar(16) NULL AFTER `kind`');
    await q.query('ALTER TABLE `reconciliation_runs` ADD `by_medium` json NULL AFTER `differences_found`');
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `reconciliation_runs` DROP COLUMN `by_medium`');
    await q.query('ALTER TABLE `reconciliation_differences` DROP COLUMN `medium`');
  }
}
