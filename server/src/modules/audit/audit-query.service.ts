// Reading the audit log of one station: filters, pages newest first, and the CSV of every matching row.
import type { DataSource } from 'typeorm';
import Papa from 'papaparse';
import type { AuditPage, AuditQuery, AuditRow } from '@shared/schemas/audit-log';

const PAGE = 100;
/** A CSV holds at most this many rows; narrow the filters for more (a quarter of a busy station fits). */
export const AUDIT_CSV_LIMIT = 50_000;

interface Raw { id: string; at: Date; actor_label: string; action: string; entity_type: string; entity_id: string; before: unknown; after: unknown }

function where(stationId: number, q: AuditQuery): { sql: string; params: unknown[] } {
  const parts = ['station_id = ?'];
  const params: unknown[] = [stationId];
  if (q.flightId !== undefined) {
    // A row is about a flight when the flight is its subject, or when its payload names the flight.
    parts.push(`((entity_type = 'flight' AND entity_id = ?) OR JSON_VALUE(\`after\`, '$.flightId') = ? OR JSON_VALUE(\`before\`, '$.flightId') = ?)`);
    params.push(String(q.flightId), q.flightId, q.flightId);
  }
  const like = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);
  if (q.actor) {
    parts.push('actor_label LIKE ?');
    params.push(`%${like(q.actor)}%`);
  }
  if (q.action) {
    parts.push('action LIKE ?');
    params.push(`${like(q.action)}%`);
  }
  if (q.from) {
    parts.push('at >= ?');
    params.push(new Date(q.from));
  }
  if (q.to) {
    parts.push('at <= ?');
    params.push(new Date(q.to));
  }
  if (q.beforeId) {
    parts.push('id < ?');
    params.push(q.beforeId);
  }
  return { sql: parts.join(' AND '), params };
}

// mysql2 hands JSON columns back parsed on MariaDB only when declared JSON; MariaDB stores JSON as LONGTEXT, so parse here.
const json = (v: unknown) => (typeof v === 'string' ? (JSON.parse(v) as unknown) : v);

function present(r: Raw): AuditRow {
  return { id: String(r.id), at: new Date(r.at).toISOString(), actor: r.actor_label, action: r.action, entityType: r.entity_type, entityId: r.entity_id, before: json(r.before), after: json(r.after) };
}

export async function auditPage(db: DataSource, stationId: number, q: AuditQuery): Promise<AuditPage> {
  const w = where(stationId, q);
  const rows: Raw[] = await db.query(`SELECT id, at, actor_label, action, entity_type, entity_id, \`before\`, \`after\` FROM audit_log WHERE ${w.sql} ORDER BY id DESC LIMIT ${PAGE + 1}`, w.params);
  const actions: { action: string }[] = await db.query('SELECT DISTINCT action FROM audit_log WHERE station_id = ? ORDER BY action', [stationId]);
  const more = rows.length > PAGE;
  const page = rows.slice(0, PAGE);
  return { rows: page.map(present), nextBeforeId: more ? String(page[page.length - 1].id) : null, actions: actions.map((a) => a.action) };
}

const CSV_COLUMNS = ['id', 'at_utc', 'actor', 'action', 'entity_type', 'entity_id', 'before', 'after'];

export async function auditCsv(db: DataSource, stationId: number, q: AuditQuery): Promise<string> {
  const w = where(stationId, q);
  const rows: Raw[] = await db.query(`SELECT id, at, actor_label, action, entity_type, entity_id, \`before\`, \`after\` FROM audit_log WHERE ${w.sql} ORDER BY id DESC LIMIT ${AUDIT_CSV_LIMIT}`, w.params);
  const data = rows.map(present).map((r) => [r.id, r.at, r.actor, r.action, r.entityType, r.entityId, r.before == null ? '' : JSON.stringify(r.before), r.after == null ? '' : JSON.stringify(r.after)]);
  // OWASP "CSV Injection": a cell a spreadsheet would run as a formula is escaped (papaparse escapeFormulae).
  return Papa.unparse({ fields: CSV_COLUMNS, data }, { escapeFormulae: true, newline: '\r\n' });
}
