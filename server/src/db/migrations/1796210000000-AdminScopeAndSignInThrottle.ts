import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A carrier-wide admin is an explicit grant, not something inferred from holding many stations; and the sign-in
 * throttle keeps its counters in the database so a restart or a second server process does not reset them.
 * The throttle table has the layout rate-limiter-flexible's MySQL store expects (key, points, expire in ms).
 */
export class AdminScopeAndSignInThrottle1796210000000 implements MigrationInterface {
  name = 'AdminScopeAndSignInThrottle1796210000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `users` ADD `carrier_wide` tinyint NOT NULL DEFAULT 0');
    await q.query(`CREATE TABLE \`sign_in_throttle\` (
      \`key\` varchar(255) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL,
      \`points\` int NOT NULL DEFAULT 0,
      \`expire\` bigint UNSIGNED NULL,
      PRIMARY KEY (\`key\`),
      INDEX \`idx_sign_in_throttle_expire\` (\`expire\`)
    ) ENGINE=InnoDB`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `sign_in_throttle`');
    await q.query('ALTER TABLE `users` DROP COLUMN `carrier_wide`');
  }
}
