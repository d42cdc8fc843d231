// The compensation ledger for finance: filtered by station, the flights' service dates, regime, state, medium and
// deadline, with totals per currency and per medium over exactly the filtered rows; the CSV export applies the very
// same filter, so one medium's export is the medium filter.
import Papa from 'papaparse';
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { LedgerQuery, LedgerResponse } from '@shared/schemas/finance';
import type { Medium } from '@shared/compensation/media';
import { compensationRows, COMPENSATION_FROM, passengerNameOf, presentCompensation } from '../payments/reader';
import { decimalAmount, stationScope } from './scope';
import { DUE_SOON_MINUTES } from '@shared/compensation';
import { OWED_STATES } from '../compensations/payment-deadlines';
import { ledgerKind, notARefund, refundLedgerTotals } from './refund-lines';

/** A quarter of a busy network is far below this; an export beyond it should be split by dates. */
export const CSV_ROW_LIMIT = 100_000;

export interface LedgerFilter {
  where: string;
  params: unknown[];
}

export function ledgerFilter(user: SessionUser, query: Omit<LedgerQuery, 'page' | 'pageSize'>): LedgerFilter {
  const stations = stationScope(user, query.stationId);
  if (!stations.length) return { where: '1 = 0', params: [] };
  const clauses = ['c.station_id IN (?)'];
  const params: unknown[] = [stations];
  const add = (clause: string, value: unknown) => {
    if (value === undefined) return;
    clauses.push(clause);
    params.push(value);
  };
  add('f.service_date >= ?', query.from);
  add('f.service_date <= ?', query.to);
  add('c.regime = ?', query.regime);
  add('c.state = ?', query.state);
  add('c.medium = ?', query.medium);
  if (query.due) {
    const now = new Date();
    clauses.push(`c.state IN (?) AND c.due_by IS NOT NULL AND ${query.due === 'overdue' ? 'c.due_by < ?' : 'c.due_by >= ? AND c.due_by <= ?'}`);
    params.push(OWED_STATES, now, ...(query.due === 'overdue' ? [] : [new Date(now.getTime() + DUE_SOON_MINUTES * 60_000)]));
  }
  return { where: clauses.join(' AND '), params };
}

const ORDER = 'ORDER BY f.service_date DESC, c.id DESC';

export async function ledgerPage(db: DataSource, user: SessionUser, query: LedgerQuery): Promise<LedgerResponse> {
  const filter = ledgerFilter(user, query);
  const offset = (query.page - 1) * query.pageSize;
  const [rows, [{ n }], totals, byMedium, refundTotals] = await Promise.all([
    compensationRows(db, filter.where, [...filter.params, query.pageSize, offset], `${ORDER} LIMIT ? OFFSET ?`),
    db.query(`SELECT COUNT(*) AS n ${COMPENSATION_FROM} WHERE ${filter.where}`, filter.params) as Promise<{ n: string | number }[]>,
    // A lost payment leaves the passenger owed: it counts in the amount and in what is owed, never subtracted;
    // what the passenger already spent on a card since canceled is no longer owed.
    totalsBy(db, notARefund(filter.where, filter.params), ''),
    totalsBy(db, notARefund(filter.where, filter.params), 'c.medium,'),
    refundLedgerTotals(db, filter),
  ]);
  return {
    rows: rows.map(presentCompensation),
    total: Number(n),
    page: query.page,
    pageSize: query.pageSize,
    totals: totals.map(totalOf),
    byMedium: byMedium.map((t) => ({ medium: t.medium!, ...totalOf(t) })),
    refundTotals,
  };
}

interface TotalRow { medium?: Medium; currency: string; n: string | number; amount: string | number; paid: string | number; owed: string | number; lost: string | number }

const totalOf = (t: TotalRow) => ({ currency: t.currency, count: Number(t.n), amountMinor: Number(t.amount), paidMinor: Number(t.paid), owedMinor: Number(t.owed), lostMinor: Number(t.lost) });

/** Totals per currency, or per medium and currency, over exactly the filtered rows. */
function totalsBy(db: DataSource, filter: LedgerFilter, group: '' | 'c.medium,'): Promise<TotalRow[]> {
  // A lost payment leaves the passenger owed: it counts in the amount and in what is owed, never subtracted;
  // what the passenger already spent on a card since canceled is no longer owed.
  return db.query(
    `SELECT ${group} c.currency, COUNT(*) AS n, SUM(c.amount_minor) AS amount,
            SUM(CASE WHEN c.state IN ('issued', 'settled') THEN c.amount_minor ELSE 0 END) AS paid,
            SUM(CASE WHEN c.state IN ('issued', 'settled') THEN 0
                     ELSE GREATEST(0, c.amount_minor - (SELECT COALESCE(SUM(x.spent_minor), 0) FROM provider_cards x WHERE x.compensation_id = c.id)) END) AS owed,
            SUM(CASE WHEN c.state IN ('failed', 'voided', 'canceled') THEN c.amount_minor ELSE 0 END) AS lost
       ${COMPENSATION_FROM} WHERE ${filter.where} GROUP BY ${group} c.currency ORDER BY ${group} c.currency`,
    filter.params,
  );
}

const CSV_COLUMNS = [
  'compensation_id', 'station', 'flight', 'service_date', 'passenger', 'pnr', 'regime', 'kind', 'form', 'medium', 'currency', 'amount', 'amount_minor',
  'due_by', 'drawer_id', 'cheque_number', 'credit_value_minor', 'ledger_state', 'provider_status', 'provider_card_id', 'provider_spent_minor', 'void_reason', 'last_error', 'created_at',
];

/** Every filtered row, in the list's order. Cells that a spreadsheet would run as a formula are escaped. */
export async function ledgerCsv(db: DataSource, user: SessionUser, query: Omit<LedgerQuery, 'page' | 'pageSize'>): Promise<string> {
  const filter = ledgerFilter(user, query);
  const rows = await compensationRows(db, filter.where, filter.params, `${ORDER} LIMIT ${CSV_ROW_LIMIT}`);
  const ids = rows.length ? rows.map((r) => r.id) : [0];
  const counter = new Map<number, { drawer_id: string | null; cheque_number: string | null }>(
    ((await db.query('SELECT compensation_id, drawer_id, cheque_number FROM counter_payments WHERE compensation_id IN (?)', [ids])) as { compensation_id: number; drawer_id: string | null; cheque_number: string | null }[]).map((c) => [c.compensation_id, c]),
  );
  const credit = new Map<number, number>(
    ((await db.query('SELECT id, credit_value_minor FROM compensations WHERE id IN (?) AND credit_value_minor IS NOT NULL', [ids])) as { id: number; credit_value_minor: number }[]).map((c) => [c.id, c.credit_value_minor]),
  );
  const data = rows.map((r) => [
    r.id, r.station_iata, `${r.carrier_code} ${r.flight_number}`, r.service_date, passengerNameOf(r), r.pnr ?? '', r.regime,
    ledgerKind(r), r.form, r.medium, r.currency, decimalAmount(r.amount_minor, r.currency), r.amount_minor,
    r.due_by ? new Date(r.due_by).toISOString() : '', counter.get(r.id)?.drawer_id ?? '', counter.get(r.id)?.cheque_number ?? '', credit.get(r.id) ?? '', r.state, r.pc_status ?? '', r.provider_card_id ?? '', r.pc_spent_minor ?? '', r.void_reason ?? '', r.last_error ?? '', new Date(r.created_at).toISOString(),
  ]);
  // OWASP "CSV Injection": a leading =, +, - or @ is neutralised (papaparse escapeFormulae).
  return Papa.unparse({ fields: CSV_COLUMNS, data }, { escapeFormulae: true, newline: '\r\n' });
}
