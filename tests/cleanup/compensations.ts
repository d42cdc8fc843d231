// Tests remove the money rows they made (the app never deletes them): first every row that names one of the
// compensations through a key the database declares (a table added later is found without being listed here), and
// the provider's mirror kept by value, then the compensations themselves.
type Query = (sql: string, params?: unknown[]) => Promise<unknown>;

/** Kept by value, not by key: the provider's word about a card outlives the ledger row it names. */
const BY_VALUE = ['provider_cards'];

export async function removeCompensations(query: Query, compIds: number[]): Promise<void> {
  if (!compIds.length) return;
  const children = (await query(
    `SELECT TABLE_NAME AS tbl, COLUMN_NAME AS col FROM information_schema.KEY_COLUMN_USAGE
      WHERE TABLE_SCHEMA = DATABASE() AND REFERENCED_TABLE_NAME = 'compensations' AND REFERENCED_COLUMN_NAME = 'id'`,
  )) as { tbl: string; col: string }[];
  for (const { tbl, col } of [...children, ...BY_VALUE.map((tbl) => ({ tbl, col: 'compensation_id' }))]) {
    await query(`DELETE FROM \`${tbl}\` WHERE \`${col}\` IN (?)`, [compIds]);
  }
  await query('DELETE FROM compensations WHERE id IN (?)', [compIds]);
}
