// Hand-written: alerts that a payment was lost (voided, canceled by the provider, or refused) for the station and
// finance, and passengers accommodated in another cabin (up- and downgrades) with the fare difference.
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class AlertsAndCabinChanges1796260000000 implements MigrationInterface {
  name = 'AlertsAndCabinChanges1796260000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(
      'CREATE TABLE `alerts` (`id` int NOT NULL AUTO_INCREMENT, `station_id` int NOT NULL, `flight_id` int NULL, `compensation_id` int NULL, ' +
        '`kind` varchar(32) NOT NULL, `message` varchar(400) NOT NULL, `dedupe_key` varchar(160) NOT NULL, ' +
        '`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), `resolved_at` datetime(3) NULL, `resolution` varchar(200) NULL, ' +
        '`acknowledged_at` datetime(3) NULL, `acknowledged_by_user_id` int NULL, ' +
        'UNIQUE INDEX `uq_alert_dedupe` (`dedupe_key`), INDEX `ix_alert_station_open` (`station_id`, `resolved_at`), ' +
        'INDEX `ix_alert_compensation` (`compensation_id`), PRIMARY KEY (`id`)) ENGINE=InnoDB',
    );
    await q.query(
      'CREATE TABLE `cabin_changes` (`id` int NOT NULL AUTO_INCREMENT, `station_id` int NOT NULL, `flight_id` int NOT NULL, `passenger_id` int NOT NULL, ' +
        '`booked_cabin` varchar(4) NOT NULL, `flown_cabin` varchar(4) NOT NULL, `direction` varchar(10) NOT NULL, ' +
        '`fare_difference_minor` int NOT NULL, `currency` char(3) NOT NULL, `regime` varchar(16) NOT NULL, ' +
        '`owed_minor` int NOT NULL, `owed_rule` varchar(200) NOT NULL, `reason` varchar(200) NOT NULL, ' +
        '`recorded_by_user_id` int NOT NULL, `created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), ' +
        'UNIQUE INDEX `uq_cabin_change_passenger` (`flight_id`, `passenger_id`), INDEX `ix_cabin_change_station` (`station_id`), ' +
        'PRIMARY KEY (`id`)) ENGINE=InnoDB',
    );
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `cabin_changes`');
    await q.query('DROP TABLE `alerts`');
  }
}
