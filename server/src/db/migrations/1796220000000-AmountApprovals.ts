// Hand-written: one approval table for every path that fixes a compensation amount (an opening offer, a raise, a
// sealed-bid accept, an issue, a denial override), and a station's grace after departure before the flight counts
// as gone. The existing offer approvals become rows of kind 'raise'.
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class AmountApprovals1796220000000 implements MigrationInterface {
  name = 'AmountApprovals1796220000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      'ALTER TABLE `offer_approvals` MODIFY `round_id` int NULL, ' +
        "ADD `kind` varchar(24) NOT NULL DEFAULT 'raise', ADD `flight_id` int NULL, ADD `subject_id` int NULL, " +
        'ADD `currency` char(3) NULL, ADD `limit_minor` int NULL, ADD `decided_at` datetime(3) NULL, ' +
        'ADD INDEX `ix_approval_station` (`station_id`, `status`), ADD INDEX `ix_approval_subject` (`kind`, `subject_id`, `status`)',
    );
    await queryRunner.query(
      'UPDATE `offer_approvals` a JOIN `volunteer_rounds` r ON r.id = a.round_id SET a.flight_id = r.flight_id, a.currency = r.currency',
    );
    await queryRunner.query('ALTER TABLE `stations` ADD `departure_grace_minutes` int NOT NULL DEFAULT 10');
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE `stations` DROP COLUMN `departure_grace_minutes`');
    await queryRunner.query(
      'ALTER TABLE `offer_approvals` DROP INDEX `ix_approval_subject`, DROP INDEX `ix_approval_station`, DROP COLUMN `decided_at`, ' +
        'DROP COLUMN `limit_minor`, DROP COLUMN `currency`, DROP COLUMN `subject_id`, DROP COLUMN `flight_id`, DROP COLUMN `kind`',
    );
    await queryRunner.query('DELETE FROM `offer_approvals` WHERE `round_id` IS NULL');
    await queryRunner.query('ALTER TABLE `offer_approvals` MODIFY `round_id` int NOT NULL');
  }
}
