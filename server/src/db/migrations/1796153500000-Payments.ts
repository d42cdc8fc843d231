import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Compensation payments: the provider's webhook events (each stored once), the provider account each issuance was
 * started under, what the provider last said about each card, voucher offers with the passenger's agreement, and reconciliation runs with their differences.
 */
export class Payments1796153500000 implements MigrationInterface {
  name = 'Payments1796153500000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`provider_events\` (
      \`id\` int NOT NULL AUTO_INCREMENT,
      \`event_id\` varchar(255) NOT NULL,
      \`type\` varchar(100) NOT NULL,
      \`object_id\` varchar(64) NULL,
      \`compensation_id\` int NULL,
      \`outcome\` varchar(120) NOT NULL,
      \`provider_created\` bigint NOT NULL,
      \`received_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      UNIQUE INDEX \`uq_provider_event_id\` (\`event_id\`),
      PRIMARY KEY (\`id\`)
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`payment_issuances\` (
      \`compensation_id\` int NOT NULL,
      \`provider_account\` char(16) NOT NULL,
      \`requested_at\` datetime(3) NOT NULL,
      PRIMARY KEY (\`compensation_id\`)
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`provider_cards\` (
      \`card_id\` varchar(64) NOT NULL,
      \`compensation_id\` int NULL,
      \`cardholder_id\` varchar(64) NULL,
      \`status\` varchar(16) NOT NULL,
      \`currency\` char(3) NULL,
      \`limit_minor\` int NULL,
      \`spent_minor\` int NOT NULL DEFAULT 0,
      \`last4\` char(4) NULL,
      \`exp_month\` smallint NULL,
      \`exp_year\` smallint NULL,
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      INDEX \`ix_provider_card_compensation\` (\`compensation_id\`),
      PRIMARY KEY (\`card_id\`)
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`voucher_offers\` (
      \`compensation_id\` int NOT NULL,
      \`cash_amount_minor\` int NOT NULL,
      \`currency\` char(3) NOT NULL,
      \`restrictions\` json NOT NULL,
      \`text\` text NOT NULL,
      \`sent_to\` varchar(254) NULL,
      \`offered_by_user_id\` int NOT NULL,
      \`offered_at\` datetime(3) NOT NULL,
      \`agreed_at\` datetime(3) NULL,
      \`statement\` text NULL,
      \`agreed_recorded_by_user_id\` int NULL,
      PRIMARY KEY (\`compensation_id\`)
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`reconciliation_runs\` (
      \`id\` int NOT NULL AUTO_INCREMENT,
      \`status\` varchar(16) NOT NULL DEFAULT 'running',
      \`station_ids\` json NOT NULL,
      \`started_by_user_id\` int NULL,
      \`started_by_label\` varchar(254) NOT NULL,
      \`started_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`finished_at\` datetime(3) NULL,
      \`pages_read\` int NOT NULL DEFAULT 0,
      \`cards_seen\` int NOT NULL DEFAULT 0,
      \`ledger_rows\` int NOT NULL DEFAULT 0,
      \`differences_found\` int NOT NULL DEFAULT 0,
      \`error\` varchar(500) NULL,
      \`heartbeat_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      INDEX \`ix_reconciliation_started\` (\`started_at\`),
      PRIMARY KEY (\`id\`)
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`reconciliation_differences\` (
      \`id\` int NOT NULL AUTO_INCREMENT,
      \`run_id\` int NOT NULL,
      \`kind\` varchar(32) NOT NULL,
      \`compensation_id\` int NULL,
      \`card_id\` varchar(64) NULL,
      \`ledger_value\` varchar(200) NULL,
      \`provider_value\` varchar(200) NULL,
      \`resolved_at\` datetime(3) NULL,
      \`resolved_by_user_id\` int NULL,
      \`resolved_by_label\` varchar(254) NULL,
      \`note\` varchar(500) NULL,
      INDEX \`ix_reconciliation_difference_run\` (\`run_id\`),
      PRIMARY KEY (\`id\`)
    ) ENGINE=InnoDB`);
    await q.query(`ALTER TABLE \`reconciliation_differences\` ADD CONSTRAINT \`fk_reconciliation_difference_run\` FOREIGN KEY (\`run_id\`) REFERENCES \`reconciliation_runs\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `reconciliation_differences` DROP FOREIGN KEY `fk_reconciliation_difference_run`');
    await q.query('DROP TABLE `reconciliation_differences`');
    await q.query('DROP TABLE `reconciliation_runs`');
    await q.query('DROP TABLE `voucher_offers`');
    await q.query('DROP TABLE `provider_cards`');
    await q.query('DROP TABLE `payment_issuances`');
    await q.query('DROP TABLE `provider_events`');
  }
}
