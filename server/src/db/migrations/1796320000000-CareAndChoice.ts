import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Care while a denied passenger waits and the passenger's choice: the station's allowances and partner hotels, the
 * choice recorded per compensation, the ticket refund it makes owed, and the care given with its cost.
 */
export class CareAndChoice1796320000000 implements MigrationInterface {
  name = 'CareAndChoice1796320000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('CREATE TABLE `station_care_settings` (`station_id` int NOT NULL, `refreshment_minor` int NOT NULL, `meal_minor` int NOT NULL, `hotels` json NOT NULL, `updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), PRIMARY KEY (`station_id`)) ENGINE=InnoDB');
    await q.query("CREATE TABLE `passenger_choices` (`id` int NOT NULL AUTO_INCREMENT, `compensation_id` int NOT NULL, `station_id` int NOT NULL, `flight_id` int NOT NULL, `passenger_id` int NOT NULL, `kind` varchar(20) NOT NULL, `note` varchar(300) NOT NULL DEFAULT '', `recorded_by_user_id` int NOT NULL, `recorded_by_label` varchar(254) NOT NULL, `recorded_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX `uq_passenger_choice_compensation` (`compensation_id`), PRIMARY KEY (`id`)) ENGINE=InnoDB");
    await q.query("CREATE TABLE `ticket_refunds` (`id` int NOT NULL AUTO_INCREMENT, `compensation_id` int NOT NULL, `station_id` int NOT NULL, `flight_id` int NOT NULL, `passenger_id` int NOT NULL, `amount_minor` int NOT NULL, `currency` char(3) NOT NULL, `return_flight_owed` tinyint NOT NULL, `state` varchar(12) NOT NULL DEFAULT 'owed', `rule_ref` varchar(120) NOT NULL, `created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX `ix_ticket_refund_station_state` (`station_id`, `state`), UNIQUE INDEX `uq_ticket_refund_compensation` (`compensation_id`), PRIMARY KEY (`id`)) ENGINE=InnoDB");
    await q.query('CREATE TABLE `care_given` (`id` int NOT NULL AUTO_INCREMENT, `compensation_id` int NOT NULL, `station_id` int NOT NULL, `flight_id` int NOT NULL, `passenger_id` int NOT NULL, `kind` varchar(16) NOT NULL, `description` varchar(200) NOT NULL, `amount_minor` int NULL, `currency` char(3) NULL, `hotel_id` varchar(24) NULL, `hotel_name` varchar(120) NULL, `provided_by` varchar(120) NOT NULL, `recorded_by_user_id` int NOT NULL, `recorded_by_label` varchar(254) NOT NULL, `recorded_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX `ix_care_given_station_recorded` (`station_id`, `recorded_at`), INDEX `ix_care_given_compensation` (`compensation_id`), PRIMARY KEY (`id`)) ENGINE=InnoDB');
    // Every reference a key, refusing a delete that would orphan the record (money and care are never deleted).
    const keys: [string, string, string][] = [
      ['station_care_settings', 'station_id', 'stations'],
      ...['passenger_choices', 'ticket_refunds', 'care_given'].flatMap((table): [string, string, string][] => [
        [table, 'compensation_id', 'compensations'], [table, 'station_id', 'stations'], [table, 'flight_id', 'flights'], [table, 'passenger_id', 'passengers'],
      ]),
      ['passenger_choices', 'recorded_by_user_id', 'users'],
      ['care_given', 'recorded_by_user_id', 'users'],
    ];
    for (const [table, column, parent] of keys) {
      await q.query(`ALTER TABLE \`${table}\` ADD CONSTRAINT \`fk_${table}_${column}\` FOREIGN KEY (\`${column}\`) REFERENCES \`${parent}\` (\`id\`) ON DELETE RESTRICT ON UPDATE RESTRICT`);
    }
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `care_given`');
    await q.query('DROP TABLE `ticket_refunds`');
    await q.query('DROP TABLE `passenger_choices`');
    await q.query('DROP TABLE `station_care_settings`');
  }
}
