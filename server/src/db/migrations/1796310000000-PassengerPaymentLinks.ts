import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The passenger's own payment pages: single-use, short-lived links (only a hash of the token is kept) that show a
 * prepaid card's details once or take the bank account a transfer goes to, and the transfers themselves, one per
 * payment attempt (its idempotency key), with the claim a worker holds while it calls the provider.
 */
export class PassengerPaymentLinks1796310000000 implements MigrationInterface {
  name = 'PassengerPaymentLinks1796310000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`payment_links\` (
      \`id\` int NOT NULL AUTO_INCREMENT,
      \`compensation_id\` int NOT NULL,
      \`purpose\` varchar(16) NOT NULL,
      \`attempt_key\` varchar(80) NOT NULL,
      \`token_hash\` char(64) NOT NULL,
      \`expires_at\` datetime(3) NOT NULL,
      \`used_at\` datetime(3) NULL,
      \`wrong_tries\` int NOT NULL DEFAULT 0,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      UNIQUE INDEX \`uq_payment_link_token\` (\`token_hash\`),
      INDEX \`ix_payment_link_compensation\` (\`compensation_id\`, \`purpose\`),
      PRIMARY KEY (\`id\`),
      CONSTRAINT \`fk_payment_links_compensation\` FOREIGN KEY (\`compensation_id\`) REFERENCES \`compensations\` (\`id\`) ON DELETE RESTRICT
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`payouts\` (
      \`id\` int NOT NULL AUTO_INCREMENT,
      \`compensation_id\` int NOT NULL,
      \`attempt_key\` varchar(80) NOT NULL,
      \`state\` varchar(16) NOT NULL DEFAULT 'awaiting-details',
      \`amount_minor\` int NOT NULL,
      \`currency\` char(3) NOT NULL,
      \`payment_method_id\` varchar(64) NULL,
      \`account_last4\` char(4) NULL,
      \`provider_payment_id\` varchar(64) NULL,
      \`claimed_until\` datetime(3) NULL,
      \`last_error\` varchar(300) NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      UNIQUE INDEX \`uq_payout_attempt\` (\`attempt_key\`),
      UNIQUE INDEX \`uq_payout_provider_payment\` (\`provider_payment_id\`),
      INDEX \`ix_payout_compensation\` (\`compensation_id\`),
      INDEX \`ix_payout_state\` (\`state\`, \`claimed_until\`),
      PRIMARY KEY (\`id\`),
      CONSTRAINT \`fk_payouts_compensation\` FOREIGN KEY (\`compensation_id\`) REFERENCES \`compensations\` (\`id\`) ON DELETE RESTRICT
    ) ENGINE=InnoDB`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `payouts`');
    await q.query('DROP TABLE `payment_links`');
  }
}
