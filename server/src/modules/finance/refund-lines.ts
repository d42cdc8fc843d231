// Refunds the rules add to compensation (optional fees not received, a downgrade), counted apart from compensation:
// the ledger's compensation totals leave their payment rows out and give them totals of their own; the period report
// adds one line per kind of refund, with the amounts due and paid.
import type { DataSource } from 'typeorm';
import { PAID_STATES, type ReportLine } from '@shared/schemas/finance';
import { REFUND_PAYMENT_KINDS, REFUND_SOURCE_KINDS, RULE_REFUND_KINDS, RULE_REFUND_LABELS, type RuleRefundKind } from '@shared/schemas/refunds';
import { COMPENSATION_FROM } from '../payments/reader';

/** SQL for "this compensations row is a compensation, not a refund's payment"; its parameter is REFUND_PAYMENT_KINDS. */
export const NOT_A_REFUND = 'c.source_kind NOT IN (?)';
export const notARefund = (where: string, params: unknown[]) => ({ where: `${where} AND ${NOT_A_REFUND}`, params: [...params, REFUND_PAYMENT_KINDS] });

/** The ledger's kind column: volunteer, involuntary, or the kind of refund a row pays. */
export function ledgerKind(row: { source_kind: string; voluntary: number | boolean }): string {
  const refund = (Object.entries(REFUND_SOURCE_KINDS) as [RuleRefundKind, string][]).find(([, kind]) => kind === row.source_kind);
  if (refund) return `refund: ${refund[0]}`;
  return row.voluntary ? 'volunteer' : 'involuntary';
}

interface TotalRow { currency: string; n: string | number; amount: string | number; paid: string | number; owed: string | number; lost: string | number }

/** The refunds among the ledger's filtered rows, per currency, counted the way compensation is. */
export async function refundLedgerTotals(db: DataSource, filter: { where: string; params: unknown[] }) {
  const rows: TotalRow[] = await db.query(
    `SELECT c.currency, COUNT(*) AS n, SUM(c.amount_minor) AS amount,
            SUM(CASE WHEN c.state IN (?) THEN c.amount_minor ELSE 0 END) AS paid,
            SUM(CASE WHEN c.state IN (?) THEN 0 ELSE c.amount_minor END) AS owed,
            SUM(CASE WHEN c.state IN ('failed', 'voided', 'canceled') THEN c.amount_minor ELSE 0 END) AS lost
       ${COMPENSATION_FROM} WHERE ${filter.where} AND c.source_kind IN (?) GROUP BY c.currency ORDER BY c.currency`,
    [PAID_STATES, PAID_STATES, ...filter.params, REFUND_PAYMENT_KINDS],
  );
  return rows.map((t) => ({ currency: t.currency, count: Number(t.n), amountMinor: Number(t.amount), paidMinor: Number(t.paid), owedMinor: Number(t.owed), lostMinor: Number(t.lost) }));
}

const SOURCES: Record<RuleRefundKind, string> = {
  'optional-fees': '14 CFR 260.1(a) (fees for ancillary services paid for and not provided); SOR/2019-150 (additional services); none under Reg. 261/2004',
  downgrade: 'Reg. (EC) 261/2004 Art. 10(2) and the retained UK text (30 / 50 / 75 % by distance); 14 CFR 250.6(c); SOR/2019-150 (lower class)',
};

/** One line per kind of refund: passengers refunded, the amounts due, and what was paid, per currency. */
export async function refundReportLines(db: DataSource, stationId: number, from: string, to: string): Promise<ReportLine[]> {
  const rows: { kind: RuleRefundKind; currency: string; n: string | number; amount: string | number; paid: string | number }[] = await db.query(
    `SELECT rr.kind, rr.currency, COUNT(*) AS n, SUM(rr.amount_minor) AS amount, SUM(CASE WHEN c.state IN (?) THEN rr.amount_minor ELSE 0 END) AS paid
       FROM rule_refunds rr JOIN flights f ON f.id = rr.flight_id JOIN compensations c ON c.id = rr.payment_compensation_id
      WHERE rr.station_id = ? AND f.service_date BETWEEN ? AND ? GROUP BY rr.kind, rr.currency ORDER BY rr.kind, rr.currency`,
    [PAID_STATES, stationId, from, to],
  );
  return RULE_REFUND_KINDS.flatMap((kind) => {
    const mine = rows.filter((r) => r.kind === kind);
    const count = mine.reduce((s, r) => s + Number(r.n), 0);
    const paid = mine.map((r) => `${Number(r.paid)} ${r.currency}`).join(', ');
    return [{
      code: `refund-${kind}`, label: `Refunds beside compensation: ${RULE_REFUND_LABELS[kind].toLowerCase()}`, count,
      amounts: mine.map((r) => ({ currency: r.currency, amountMinor: Number(r.amount) })),
      note: `Counted apart from compensation. Paid so far (minor units): ${paid || 'none'}.`, source: SOURCES[kind],
    }];
  });
}
