import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The flights whose forecast must be recomputed, in MariaDB so that several server processes share them and a
 * process that dies leaves its work to the others. One row per flight: asking again while a recompute runs only
 * raises `requests`, so the burst is taken together by one more recompute (the latest state wins).
 */
export class RecomputeQueue1796600000000 implements MigrationInterface {
  name = 'RecomputeQueue1796600000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(
      'CREATE TABLE `forecast_recompute_queue` (`flight_id` int NOT NULL, `requests` bigint NOT NULL DEFAULT 1, `only_if_moved` tinyint NOT NULL, ' +
        '`requested_by` varchar(96) NOT NULL, `requested_at` datetime(3) NOT NULL, `claimed_by` varchar(96) NULL, `claimed_requests` bigint NULL, ' +
        '`claimed_only_if_moved` tinyint NULL, `lease_until` datetime(3) NULL, PRIMARY KEY (`flight_id`), INDEX `ix_recompute_queue_due` (`requested_at`), ' +
        'CONSTRAINT `fk_recompute_queue_flight` FOREIGN KEY (`flight_id`) REFERENCES `flights`(`id`) ON DELETE CASCADE ON UPDATE NO ACTION) ENGINE=InnoDB',
    );
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `forecast_recompute_queue`');
  }
}
