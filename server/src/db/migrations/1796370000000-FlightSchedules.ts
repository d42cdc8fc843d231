import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Weekly schedules an admin keeps, and on each flight the schedule that generated it (null for the feed's and the demo's). */
export class FlightSchedules1796370000000 implements MigrationInterface {
  name = 'FlightSchedules1796370000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(
      'CREATE TABLE `flight_schedules` (`id` int NOT NULL AUTO_INCREMENT, `station_id` int NOT NULL, `carrier_code` varchar(3) NOT NULL, `flight_number` varchar(5) NOT NULL, ' +
        '`destination` char(3) NOT NULL, `departure_time` char(5) NOT NULL, `block_minutes` int NOT NULL, `seats_by_cabin` json NOT NULL, `aircraft_type` varchar(8) NULL, ' +
        '`weekdays` json NOT NULL, `valid_from` date NOT NULL, `valid_to` date NOT NULL, `cancelled` tinyint NOT NULL DEFAULT 0, `created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), ' +
        'INDEX `ix_schedule_station` (`station_id`, `valid_from`), PRIMARY KEY (`id`), ' +
        'CONSTRAINT `fk_schedule_station` FOREIGN KEY (`station_id`) REFERENCES `stations`(`id`) ON DELETE NO ACTION ON UPDATE NO ACTION) ENGINE=InnoDB',
    );
    await q.query('ALTER TABLE `flights` ADD `schedule_id` int NULL');
    await q.query('ALTER TABLE `flights` ADD CONSTRAINT `fk_flight_schedule` FOREIGN KEY (`schedule_id`) REFERENCES `flight_schedules`(`id`) ON DELETE SET NULL ON UPDATE NO ACTION');
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `flights` DROP FOREIGN KEY `fk_flight_schedule`');
    await q.query('ALTER TABLE `flights` DROP COLUMN `schedule_id`');
    await q.query('DROP TABLE `flight_schedules`');
  }
}
