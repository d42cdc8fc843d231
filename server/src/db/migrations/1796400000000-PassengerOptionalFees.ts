import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The extras each passenger paid on top of the fare (seat selection, bags…), which some rules refund to a denied passenger. */
export class PassengerOptionalFees1796400000000 implements MigrationInterface {
  name = 'PassengerOptionalFees1796400000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query("ALTER TABLE `passengers` ADD `optional_fees` json NOT NULL DEFAULT '[]'");
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `passengers` DROP COLUMN `optional_fees`');
  }
}
