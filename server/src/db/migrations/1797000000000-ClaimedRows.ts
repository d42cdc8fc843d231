import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The tables whose rows a worker claims before it calls out (mail, cards, bank transfers) carry the same two
 * columns: who holds the row (`claimed_by`, a token of one claim) and until when (`lease_until`). The payouts'
 * `claimed_until` becomes `lease_until`; its index follows the column.
 */
export class ClaimedRows1797000000000 implements MigrationInterface {
  name = 'ClaimedRows1797000000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `outbox_messages` ADD `claimed_by` varchar(96) NULL, ADD `lease_until` datetime(3) NULL');
    await q.query('ALTER TABLE `compensations` ADD `claimed_by` varchar(96) NULL, ADD `lease_until` datetime(3) NULL');
    await q.query('ALTER TABLE `payouts` ADD `claimed_by` varchar(96) NULL, RENAME COLUMN `claimed_until` TO `lease_until`');
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `payouts` DROP COLUMN `claimed_by`, RENAME COLUMN `lease_until` TO `claimed_until`');
    await q.query('ALTER TABLE `compensations` DROP COLUMN `claimed_by`, DROP COLUMN `lease_until`');
    await q.query('ALTER TABLE `outbox_messages` DROP COLUMN `claimed_by`, DROP COLUMN `lease_until`');
  }
}
