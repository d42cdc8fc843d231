import type { PeriodReport } from '@shared/schemas/finance';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
import { formatMoney } from '../../../lib/format';

/** The quarter by medium: owed through each, paid as its own record shows, and what is still on live cards. */
export function ReportMediaTable({ lines }: { lines: PeriodReport['byMedium'] }) {
  if (!lines.length) return <p className="text-ink-soft">No compensation in this quarter, so nothing by medium.</p>;
  return (
    <table className="w-full border-collapse text-left text-sm" aria-label="By medium">
      <thead className="bg-harbour-soft">
        <tr>{['Medium', 'Paid figure from', 'Passengers', 'Owed through it', 'Paid', 'Outstanding', 'Credit value issued'].map((h) => <th key={h} scope="col" className="p-2">{h}</th>)}</tr>
      </thead>
      <tbody>
        {lines.map((l) => (
          <tr key={`${l.medium}-${l.currency}`} className="border-t border-line" data-testid={`report-medium-${l.medium}`}>
            <th scope="row" className="p-2">{MEDIUM_LABELS[l.medium]}</th>
            <td className="p-2">{l.recordedIn}{l.detail && ` · ${l.detail}`}</td>
            <td className="p-2 tabular-nums">{l.count}</td>
            <td className="p-2 tabular-nums">{formatMoney(l.owedMinor, l.currency)}</td>
            <td className="p-2 tabular-nums">{formatMoney(l.paidMinor, l.currency)}</td>
            <td className="p-2 tabular-nums">{l.medium === 'prepaid-card' || l.medium === 'travel-credit' ? formatMoney(l.outstandingMinor, l.currency) : '—'}</td>
            <td className="p-2 tabular-nums">{l.medium === 'travel-credit' ? formatMoney(l.creditValueMinor, l.currency) : '—'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
