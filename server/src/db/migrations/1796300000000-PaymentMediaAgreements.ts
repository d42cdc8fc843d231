// Hand-written: each compensation's payment deadline and travel-credit terms; the passenger's agreement to a card
// or a credit as a record of its own (exact text, acceptance, time, staff member); payments made at the counter in
// cash or by cheque, with the receipt the passenger signed. One counter payment per compensation, one cheque number
// per station. Both follow their compensation if a test or a demo reload removes it; production never deletes one.
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class PaymentMediaAgreements1796300000000 implements MigrationInterface {
  name = 'PaymentMediaAgreements1796300000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(
      'ALTER TABLE `compensations` ADD `due_by` datetime(3) NULL, ADD `due_rule_ref` varchar(120) NULL, ' +
        'ADD `credit_value_minor` int NULL, ADD `credit_expires_on` date NULL, ADD INDEX `ix_compensation_due_by` (`state`, `due_by`)',
    );
    await q.query(
      'CREATE TABLE `payment_agreements` (`id` int NOT NULL AUTO_INCREMENT, `compensation_id` int NOT NULL, `medium` varchar(16) NOT NULL, ' +
        '`text` text NOT NULL, `cash_amount_minor` int NOT NULL, `value_minor` int NOT NULL, `currency` char(3) NOT NULL, `expires_on` date NULL, ' +
        '`method` varchar(20) NOT NULL, `signature` mediumtext NULL, `statement` text NULL, `accepted_at` datetime(3) NOT NULL, ' +
        '`staff_user_id` int NULL, `created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), ' +
        'UNIQUE INDEX `uq_agreement_compensation` (`compensation_id`), PRIMARY KEY (`id`), ' +
        'CONSTRAINT `fk_agreement_compensation` FOREIGN KEY (`compensation_id`) REFERENCES `compensations` (`id`) ON DELETE RESTRICT, ' +
        'CONSTRAINT `fk_payment_agreements_staff_user_id` FOREIGN KEY (`staff_user_id`) REFERENCES `users` (`id`) ON DELETE RESTRICT) ENGINE=InnoDB',
    );
    await q.query(
      'CREATE TABLE `counter_payments` (`id` int NOT NULL AUTO_INCREMENT, `compensation_id` int NOT NULL, `station_id` int NOT NULL, ' +
        '`medium` varchar(16) NOT NULL, `drawer_id` varchar(32) NULL, `cheque_number` varchar(32) NULL, `amount_minor` int NOT NULL, ' +
        '`currency` char(3) NOT NULL, `receipt_text` text NOT NULL, `signature` mediumtext NOT NULL, `paid_by_user_id` int NOT NULL, ' +
        '`paid_at` datetime(3) NOT NULL, UNIQUE INDEX `uq_counter_payment_compensation` (`compensation_id`), ' +
        'UNIQUE INDEX `uq_counter_cheque` (`station_id`, `cheque_number`), INDEX `ix_counter_drawer` (`station_id`, `drawer_id`, `paid_at`), PRIMARY KEY (`id`), ' +
        'CONSTRAINT `fk_counter_payment_compensation` FOREIGN KEY (`compensation_id`) REFERENCES `compensations` (`id`) ON DELETE RESTRICT, ' +
        'CONSTRAINT `fk_counter_payments_station_id` FOREIGN KEY (`station_id`) REFERENCES `stations` (`id`) ON DELETE RESTRICT, ' +
        'CONSTRAINT `fk_counter_payments_paid_by_user_id` FOREIGN KEY (`paid_by_user_id`) REFERENCES `users` (`id`) ON DELETE RESTRICT) ENGINE=InnoDB',
    );
    // A voucher agreed under the earlier flow stays agreed: the words recorded by staff become its agreement record,
    // with the text that was sent, so an agreed credit can still be issued and nothing is lost.
    await q.query(
      "INSERT INTO `payment_agreements` (`compensation_id`, `medium`, `text`, `cash_amount_minor`, `value_minor`, `currency`, `method`, `statement`, `accepted_at`, `staff_user_id`) " +
        "SELECT o.compensation_id, 'travel-credit', o.text, o.cash_amount_minor, c.amount_minor, o.currency, 'recorded-statement', o.statement, o.agreed_at, o.agreed_recorded_by_user_id " +
        'FROM `voucher_offers` o JOIN `compensations` c ON c.id = o.compensation_id WHERE o.agreed_at IS NOT NULL',
    );
    await q.query("UPDATE `compensations` SET `credit_value_minor` = `amount_minor` WHERE `medium` = 'travel-credit'");
    // Canada's 48 h run from the denial, which the row's creation records; other rules' deadlines need the station's
    // day or the alternate's departure, which older rows do not keep, so they stay without one.
    await q.query("UPDATE `compensations` SET `due_by` = `created_at` + INTERVAL 48 HOUR, `due_rule_ref` = 'SOR/2019-150 s. 20' WHERE `regime` = 'ca-appr' AND `voluntary` = 0 AND `source_kind` = 'denial'");
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `counter_payments`');
    await q.query('DROP TABLE `payment_agreements`');
    await q.query('ALTER TABLE `compensations` DROP INDEX `ix_compensation_due_by`, DROP COLUMN `due_by`, DROP COLUMN `due_rule_ref`, DROP COLUMN `credit_value_minor`, DROP COLUMN `credit_expires_on`');
  }
}
