// Hand-written: alerts about work waiting for someone (a volunteer from a phone, an amount waiting for a supervisor
// or decided, a denial proposal) name what they are about, so an alert closes by itself once that is decided.
//
// These keys CASCADE: an alert is a pointer to its subject, not a record of its own (the audit log keeps the
// history), so it goes with the volunteer, approval or proposal it points at.
import type { MigrationInterface, QueryRunner } from 'typeorm';

const SUBJECTS = [
  { column: 'volunteer_id', parent: 'volunteers' },
  { column: 'approval_id', parent: 'offer_approvals' },
  { column: 'denial_proposal_id', parent: 'denial_proposals' },
] as const;

export class AlertSubjects1796900000000 implements MigrationInterface {
  name = 'AlertSubjects1796900000000';

  public async up(q: QueryRunner): Promise<void> {
    for (const s of SUBJECTS) {
      await q.query(`ALTER TABLE \`alerts\` ADD \`${s.column}\` int NULL, ADD INDEX \`ix_alert_${s.column}\` (\`${s.column}\`)`);
      await q.query(`ALTER TABLE \`alerts\` ADD CONSTRAINT \`fk_alerts_${s.column}\` FOREIGN KEY (\`${s.column}\`) REFERENCES \`${s.parent}\` (\`id\`) ON DELETE CASCADE`);
    }
  }

  public async down(q: QueryRunner): Promise<void> {
    for (const s of [...SUBJECTS].reverse()) {
      await q.query(`ALTER TABLE \`alerts\` DROP FOREIGN KEY \`fk_alerts_${s.column}\``);
      await q.query(`ALTER TABLE \`alerts\` DROP INDEX \`ix_alert_${s.column}\`, DROP COLUMN \`${s.column}\``);
    }
  }
}
