import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * How each compensation reaches the passenger (cash, cheque, bank transfer, prepaid card, travel credit). Existing
 * rows keep what they were: a voucher was a travel credit on a restricted card, everything else a prepaid card.
 */
export class CompensationMedium1796295000000 implements MigrationInterface {
  name = 'CompensationMedium1796295000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query("ALTER TABLE `compensations` ADD `medium` varchar(16) NOT NULL DEFAULT 'prepaid-card'");
    await q.query("UPDATE `compensations` SET `medium` = 'travel-credit' WHERE `form` = 'voucher'");
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `compensations` DROP COLUMN `medium`');
  }
}
