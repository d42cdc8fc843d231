// Hand-written: when a denial recorded after the fact really happened, and refusals of carriage for safety,
// security, health or conduct, which are their own outcome and never a denial of boarding.
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class RefusalsAndRecordedDenials1796240000000 implements MigrationInterface {
  name = 'RefusalsAndRecordedDenials1796240000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE `denials` ADD `occurred_at` datetime(3) NULL');
    await queryRunner.query(
      'CREATE TABLE `boarding_refusals` (`id` int NOT NULL AUTO_INCREMENT, `flight_id` int NOT NULL, `station_id` int NOT NULL, ' +
        '`booking_id` int NOT NULL, `passenger_ids` json NOT NULL, `ground` varchar(12) NOT NULL, `reason` varchar(300) NOT NULL, ' +
        '`refused_by_user_id` int NOT NULL, `refused_by_label` varchar(254) NOT NULL, `refused_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), ' +
        'INDEX `ix_boarding_refusal_flight` (`flight_id`), PRIMARY KEY (`id`)) ENGINE=InnoDB',
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE `boarding_refusals`');
    await queryRunner.query('ALTER TABLE `denials` DROP COLUMN `occurred_at`');
  }
}
