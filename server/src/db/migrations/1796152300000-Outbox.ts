import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Transactional outbox for e-mail: rows written with the business change, sent later by a worker. */
export class Outbox1796152300000 implements MigrationInterface {
  name = 'Outbox1796152300000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`outbox_messages\` (
      \`id\` char(36) NOT NULL,
      \`station_id\` int NOT NULL,
      \`flight_id\` int NULL,
      \`passenger_ids\` json NOT NULL,
      \`kind\` varchar(40) NOT NULL,
      \`to_address\` varchar(254) NOT NULL,
      \`subject\` varchar(300) NOT NULL,
      \`text\` mediumtext NOT NULL,
      \`html\` mediumtext NULL,
      \`status\` varchar(10) NOT NULL DEFAULT 'pending',
      \`attempts\` int NOT NULL DEFAULT 0,
      \`next_attempt_at\` datetime(3) NOT NULL,
      \`last_error\` varchar(500) NULL,
      \`created_at\` datetime(3) NOT NULL,
      \`sent_at\` datetime(3) NULL,
      \`dedupe_key\` varchar(100) NULL,
      UNIQUE INDEX \`uq_outbox_dedupe\` (\`dedupe_key\`),
      INDEX \`ix_outbox_due\` (\`status\`, \`next_attempt_at\`),
      INDEX \`ix_outbox_flight\` (\`flight_id\`, \`created_at\`),
      CONSTRAINT \`chk_outbox_status\` CHECK (\`status\` IN ('pending', 'sent', 'failed')),
      PRIMARY KEY (\`id\`)
    ) ENGINE=InnoDB`);
    await q.query(`ALTER TABLE \`outbox_messages\` ADD CONSTRAINT \`fk_outbox_station\` FOREIGN KEY (\`station_id\`) REFERENCES \`stations\`(\`id\`) ON DELETE NO ACTION ON UPDATE NO ACTION`);
    // A flight's notices go with the flight, as its bookings do.
    await q.query(`ALTER TABLE \`outbox_messages\` ADD CONSTRAINT \`fk_outbox_flight\` FOREIGN KEY (\`flight_id\`) REFERENCES \`flights\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `outbox_messages` DROP FOREIGN KEY `fk_outbox_flight`');
    await q.query('ALTER TABLE `outbox_messages` DROP FOREIGN KEY `fk_outbox_station`');
    await q.query('DROP TABLE `outbox_messages`');
  }
}
