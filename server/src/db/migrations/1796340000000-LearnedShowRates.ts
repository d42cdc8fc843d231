import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Closed flights and each booking's outcome, training runs (at most one queued or running, enforced by a unique
 * generated column), versions of the learned rates, each station's choice of rates, and the version a forecast used.
 */
export class LearnedShowRates1796340000000 implements MigrationInterface {
  name = 'LearnedShowRates1796340000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`closed_flights\` (
      \`id\` int NOT NULL AUTO_INCREMENT, \`flight_id\` int NULL, \`station_id\` int NOT NULL,
      \`carrier_code\` varchar(3) NOT NULL, \`flight_number\` varchar(5) NOT NULL, \`service_date\` date NOT NULL,
      \`origin\` char(3) NOT NULL, \`destination\` char(3) NOT NULL, \`scheduled_departure\` datetime NOT NULL,
      \`day_of_week\` tinyint NOT NULL, \`seats_by_cabin\` json NOT NULL, \`demo\` tinyint NOT NULL DEFAULT 0,
      \`closed_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      UNIQUE INDEX \`uq_closed_flight_flight\` (\`flight_id\`),
      INDEX \`ix_closed_flight_station_departure\` (\`station_id\`, \`scheduled_departure\`),
      PRIMARY KEY (\`id\`),
      CONSTRAINT \`fk_closed_flight_station\` FOREIGN KEY (\`station_id\`) REFERENCES \`stations\`(\`id\`)
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`booking_outcomes\` (
      \`id\` int NOT NULL AUTO_INCREMENT, \`closed_flight_id\` int NOT NULL, \`passenger_id\` int NULL,
      \`pnr\` varchar(8) NOT NULL, \`cabin\` char(1) NOT NULL, \`fare_class\` varchar(16) NOT NULL,
      \`channel\` varchar(16) NOT NULL DEFAULT 'unknown', \`connecting\` tinyint NOT NULL, \`party_size\` smallint NOT NULL,
      \`checked_in_at\` datetime(3) NULL, \`checked_in_t24\` tinyint NOT NULL, \`checked_in_t3\` tinyint NOT NULL,
      \`checked_in_t1\` tinyint NOT NULL, \`outcome\` varchar(20) NOT NULL, \`corrected_at\` datetime(3) NULL,
      INDEX \`ix_outcome_closed_flight\` (\`closed_flight_id\`),
      PRIMARY KEY (\`id\`),
      CONSTRAINT \`fk_outcome_closed_flight\` FOREIGN KEY (\`closed_flight_id\`) REFERENCES \`closed_flights\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`ck_outcome_value\` CHECK (\`outcome\` IN ('showed', 'no-show', 'volunteered', 'denied', 'missed-connection'))
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`learning_jobs\` (
      \`id\` int NOT NULL AUTO_INCREMENT, \`status\` varchar(10) NOT NULL, \`trigger_kind\` varchar(10) NOT NULL,
      \`requested_by_user_id\` int NULL, \`requested_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`started_at\` datetime(3) NULL, \`finished_at\` datetime(3) NULL, \`progress\` tinyint UNSIGNED NOT NULL DEFAULT 0,
      \`stage\` varchar(80) NOT NULL DEFAULT '', \`error\` varchar(500) NULL, \`rates_version\` int NULL,
      \`requests\` int NOT NULL DEFAULT 1,
      \`active\` tinyint AS (IF(\`status\` IN ('queued', 'running'), 1, NULL)) PERSISTENT,
      UNIQUE INDEX \`uq_learning_job_active\` (\`active\`),
      PRIMARY KEY (\`id\`),
      CONSTRAINT \`fk_learning_job_user\` FOREIGN KEY (\`requested_by_user_id\`) REFERENCES \`users\`(\`id\`)
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`learned_rates\` (
      \`version\` int NOT NULL AUTO_INCREMENT, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`job_id\` int NOT NULL, \`flights_trained\` int NOT NULL, \`flights_held_out\` int NOT NULL,
      \`model\` json NOT NULL, \`calibration\` json NOT NULL,
      PRIMARY KEY (\`version\`),
      CONSTRAINT \`fk_learned_rates_job\` FOREIGN KEY (\`job_id\`) REFERENCES \`learning_jobs\`(\`id\`)
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`station_rates_choice\` (
      \`station_id\` int NOT NULL, \`mode\` varchar(10) NOT NULL, \`pinned_version\` int NULL, \`updated_by_user_id\` int NULL,
      PRIMARY KEY (\`station_id\`),
      CONSTRAINT \`fk_rates_choice_station\` FOREIGN KEY (\`station_id\`) REFERENCES \`stations\`(\`id\`),
      CONSTRAINT \`fk_rates_choice_version\` FOREIGN KEY (\`pinned_version\`) REFERENCES \`learned_rates\`(\`version\`),
      CONSTRAINT \`fk_rates_choice_user\` FOREIGN KEY (\`updated_by_user_id\`) REFERENCES \`users\`(\`id\`)
    ) ENGINE=InnoDB`);
    await q.query('ALTER TABLE `flight_forecasts` ADD `rates_version` int NULL');
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `flight_forecasts` DROP COLUMN `rates_version`');
    await q.query('DROP TABLE `station_rates_choice`');
    await q.query('DROP TABLE `learned_rates`');
    await q.query('DROP TABLE `learning_jobs`');
    await q.query('DROP TABLE `booking_outcomes`');
    await q.query('DROP TABLE `closed_flights`');
  }
}
