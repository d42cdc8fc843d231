// Hand-written: how each compensation's amount was cleared against someone's limit (the rule for a denial, a gated
// offer, an approval), so the issue path knows which amounts still need a supervisor. Denials' amounts come from
// the rule and were authorized by a supervisor; volunteers' amounts recorded before the gate existed stay unknown.
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CompensationAmountCleared1796220100000 implements MigrationInterface {
  name = 'CompensationAmountCleared1796220100000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE `compensations` ADD `amount_cleared_by` varchar(40) NULL');
    await queryRunner.query("UPDATE `compensations` SET `amount_cleared_by` = 'rule' WHERE `source_kind` = 'denial'");
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE `compensations` DROP COLUMN `amount_cleared_by`');
  }
}
