import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Booking-limit plans saved from the planner, listed per station and route, newest first. */
export class SavedPlans1796151413700 implements MigrationInterface {
  name = 'SavedPlans1796151413700';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`saved_plans\` (
      \`id\` int NOT NULL AUTO_INCREMENT,
      \`station_id\` int NOT NULL,
      \`route_key\` varchar(32) NOT NULL,
      \`name\` varchar(100) NOT NULL,
      \`inputs\` json NOT NULL,
      \`result\` json NOT NULL,
      \`created_by_user_id\` int NOT NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      INDEX \`ix_saved_plan_route\` (\`station_id\`, \`route_key\`, \`created_at\`),
      PRIMARY KEY (\`id\`)
    ) ENGINE=InnoDB`);
    await q.query(`ALTER TABLE \`saved_plans\` ADD CONSTRAINT \`fk_saved_plan_station\` FOREIGN KEY (\`station_id\`) REFERENCES \`stations\`(\`id\`) ON DELETE NO ACTION ON UPDATE NO ACTION`);
    await q.query(`ALTER TABLE \`saved_plans\` ADD CONSTRAINT \`fk_saved_plan_user\` FOREIGN KEY (\`created_by_user_id\`) REFERENCES \`users\`(\`id\`) ON DELETE NO ACTION ON UPDATE NO ACTION`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `saved_plans` DROP FOREIGN KEY `fk_saved_plan_user`');
    await q.query('ALTER TABLE `saved_plans` DROP FOREIGN KEY `fk_saved_plan_station`');
    await q.query('DROP TABLE `saved_plans`');
  }
}
