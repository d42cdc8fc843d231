// Deleting demo flights with everything that hangs off them, children before parents, by walking the foreign keys the
// database itself declares: a table added later is found without anyone remembering to list it here.
import type { EntityManager } from 'typeorm';

/** Rows that record money paid or owed: never deleted, so a walk that reaches them stops with an error instead. */
const MONEY_TABLES = new Set(['compensations', 'payment_issuances', 'payouts', 'voucher_offers', 'provider_cards', 'provider_events', 'reconciliation_runs', 'reconciliation_differences']);

/** A row's id: a number, or a UUID for the outbox. */
type Key = number | string;

interface ChildKey {
  table: string;
  column: string;
  hasId: boolean;
}

async function childKeys(em: EntityManager, parent: string): Promise<ChildKey[]> {
  const rows: { tbl: string; col: string; has_id: number | string }[] = await em.query(
    `SELECT k.TABLE_NAME AS tbl, k.COLUMN_NAME AS col,
       EXISTS (SELECT 1 FROM information_schema.COLUMNS c WHERE c.TABLE_SCHEMA = k.TABLE_SCHEMA AND c.TABLE_NAME = k.TABLE_NAME AND c.COLUMN_NAME = 'id') AS has_id
     FROM information_schema.KEY_COLUMN_USAGE k
     WHERE k.TABLE_SCHEMA = DATABASE() AND k.REFERENCED_TABLE_NAME = ? AND k.REFERENCED_COLUMN_NAME = 'id'
     ORDER BY k.TABLE_NAME, k.COLUMN_NAME`,
    [parent],
  );
  return rows.map((r) => ({ table: r.tbl, column: r.col, hasId: Number(r.has_id) === 1 }));
}

function refuseMoney(table: string, ids: Key[]) {
  if (MONEY_TABLES.has(table)) throw new Error(`refusing to delete money rows from ${table} (ids ${ids.slice(0, 10).join(', ')})`);
}

/**
 * Deletes the rows of `table` with these ids, after everything that references them (depth first), and counts what
 * went per table for the audit row.
 */
export async function deleteInDependencyOrder(em: EntityManager, table: string, ids: Key[], counts: Record<string, number> = {}): Promise<Record<string, number>> {
  if (!ids.length) return counts;
  refuseMoney(table, ids);
  for (const child of await childKeys(em, table)) {
    if (child.hasId) {
      const rows: { id: Key }[] = await em.query(`SELECT id FROM \`${child.table}\` WHERE \`${child.column}\` IN (?)`, [ids]);
      await deleteInDependencyOrder(em, child.table, rows.map((r) => r.id), counts);
      continue;
    }
    // A table without an id of its own (keyed by its parent) is a leaf: nothing can reference it.
    const [{ n }] = await em.query(`SELECT COUNT(*) AS n FROM \`${child.table}\` WHERE \`${child.column}\` IN (?)`, [ids]);
    if (Number(n) === 0) continue;
    refuseMoney(child.table, ids);
    await em.query(`DELETE FROM \`${child.table}\` WHERE \`${child.column}\` IN (?)`, [ids]);
    counts[child.table] = (counts[child.table] ?? 0) + Number(n);
  }
  const result: { affectedRows?: number } = await em.query(`DELETE FROM \`${table}\` WHERE id IN (?)`, [ids]);
  counts[table] = (counts[table] ?? 0) + Number(result.affectedRows ?? ids.length);
  return counts;
}

/**
 * Flights a money row stands on, and the flights their rebookings name (the planned arrival fixed the amount):
 * these stay when the demo is refreshed.
 */
export async function flightsHeldByMoney(em: EntityManager): Promise<number[]> {
  const held = new Set<number>((await em.query('SELECT DISTINCT flight_id AS id FROM compensations')).map((r: { id: number }) => Number(r.id)));
  for (let grew = held.size > 0; grew;) {
    const rows: { a: number; b: number | null }[] = await em.query(
      'SELECT original_flight_id AS a, alternate_flight_id AS b FROM rebookings WHERE original_flight_id IN (?) OR alternate_flight_id IN (?)',
      [[...held], [...held]],
    );
    const before = held.size;
    for (const r of rows) for (const id of [r.a, r.b]) if (id !== null) held.add(Number(id));
    grew = held.size > before;
  }
  return [...held];
}
