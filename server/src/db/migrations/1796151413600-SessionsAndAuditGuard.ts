import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The session table the MySQL session store reads (created here so schema changes stay in migrations), and
 * triggers that make the audit log append-only at the database, not just by convention in the code.
 */
export class SessionsAndAuditGuard1796151413600 implements MigrationInterface {
  name = 'SessionsAndAuditGuard1796151413600';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`sessions\` (
      \`session_id\` varchar(128) COLLATE utf8mb4_bin NOT NULL,
      \`expires\` int unsigned NOT NULL,
      \`data\` mediumtext COLLATE utf8mb4_bin,
      PRIMARY KEY (\`session_id\`)
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TRIGGER \`audit_log_no_update\` BEFORE UPDATE ON \`audit_log\` FOR EACH ROW
      SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_log is append-only'`);
    await q.query(`CREATE TRIGGER \`audit_log_no_delete\` BEFORE DELETE ON \`audit_log\` FOR EACH ROW
      SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_log is append-only'`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TRIGGER `audit_log_no_delete`');
    await q.query('DROP TRIGGER `audit_log_no_update`');
    await q.query('DROP TABLE `sessions`');
  }
}
