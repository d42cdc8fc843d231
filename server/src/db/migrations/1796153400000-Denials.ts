// Hand-written: station boarding-priority rules, denial proposals and the denials selected in them.
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Denials1796153400000 implements MigrationInterface {
  name = 'Denials1796153400000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      'CREATE TABLE `station_priority_rules` (`station_id` int NOT NULL, `rules` json NOT NULL, `tier_order` json NOT NULL, ' +
        '`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), PRIMARY KEY (`station_id`)) ENGINE=InnoDB',
    );
    await queryRunner.query(
      'CREATE TABLE `denial_proposals` (`id` int NOT NULL AUTO_INCREMENT, `flight_id` int NOT NULL, `station_id` int NOT NULL, ' +
        "`status` varchar(12) NOT NULL DEFAULT 'proposed', `seats_needed` int NOT NULL, `proposed_by_user_id` int NOT NULL, " +
        '`proposed_by_label` varchar(254) NOT NULL, `proposed_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), ' +
        '`decided_by_user_id` int NULL, `decided_at` datetime(3) NULL, `reason` varchar(300) NOT NULL, ' +
        'INDEX `ix_denial_proposal_flight` (`flight_id`, `status`), INDEX `ix_denial_proposal_station` (`station_id`, `status`), ' +
        'PRIMARY KEY (`id`)) ENGINE=InnoDB',
    );
    await queryRunner.query(
      'CREATE TABLE `denials` (`id` int NOT NULL AUTO_INCREMENT, `proposal_id` int NOT NULL, `flight_id` int NOT NULL, `station_id` int NOT NULL, ' +
        '`booking_id` int NOT NULL, `passenger_ids` json NOT NULL, `position` int NOT NULL, `reasons` json NOT NULL, ' +
        "`status` varchar(12) NOT NULL DEFAULT 'proposed', `selected_by_user_id` int NOT NULL, `authorized_by_user_id` int NULL, " +
        '`authorized_at` datetime(3) NULL, `change_reason` varchar(300) NULL, `category` varchar(4) NULL, `compensation` json NULL, ' +
        '`statement_message_ids` json NULL, `created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), ' +
        'INDEX `ix_denial_flight` (`flight_id`, `status`), INDEX `ix_denial_proposal` (`proposal_id`), PRIMARY KEY (`id`)) ENGINE=InnoDB',
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE `denials`');
    await queryRunner.query('DROP TABLE `denial_proposals`');
    await queryRunner.query('DROP TABLE `station_priority_rules`');
  }
}
