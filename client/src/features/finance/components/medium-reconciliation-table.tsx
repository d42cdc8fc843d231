import { RECONCILED_AGAINST_LABELS, type ReconciliationRun } from '@shared/schemas/finance';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
import { formatMoney } from '../../../lib/format';

const amounts = (list: { currency: string; amountMinor: number }[]) => (list.length ? list.map((a) => formatMoney(a.amountMinor, a.currency)).join(' · ') : '—');

/** One line per medium: what it was compared with, how many records on each side, the money, and what differs. */
export function MediumReconciliationTable({ lines }: { lines: ReconciliationRun['byMedium'] }) {
  if (!lines.length) return <p className="text-sm text-ink-soft">This run is from before reconciliation read each medium apart.</p>;
  return (
    <table className="w-full border-collapse text-left" aria-label="Reconciliation by medium">
      <thead className="bg-harbour-soft">
        <tr>{['Medium', 'Compared with', 'In the ledger', 'On the other side', 'Paid there', 'Outstanding', 'Differences'].map((h) => <th key={h} scope="col" className="p-2">{h}</th>)}</tr>
      </thead>
      <tbody>
        {lines.map((l) => (
          <tr key={l.medium} className="border-t border-line" data-testid={`recon-medium-${l.medium}`}>
            <th scope="row" className="p-2">{MEDIUM_LABELS[l.medium]}</th>
            <td className="p-2">{RECONCILED_AGAINST_LABELS[l.against]}</td>
            <td className="p-2 tabular-nums">{l.ledgerRows}</td>
            <td className="p-2 tabular-nums">{l.otherSide}</td>
            <td className="p-2 tabular-nums">{amounts(l.paid)}</td>
            <td className="p-2 tabular-nums">{amounts(l.outstanding)}</td>
            <td className={`p-2 font-bold ${l.differences ? 'text-alert' : 'text-calm'}`}>{l.differences ? l.differences : '✓ none'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
