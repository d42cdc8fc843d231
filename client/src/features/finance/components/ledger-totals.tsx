import type { LedgerResponse } from '@shared/schemas/finance';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
import { formatMoney } from '../../../lib/format';

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** One card per currency: amounts in different currencies are never added together. */
export function LedgerTotals({ totals, total }: { totals: LedgerResponse['totals']; total: number }) {
  if (!totals.length) return <p className="text-ink-soft">No compensations match these filters.</p>;
  return (
    <section aria-label="Totals per currency" className="flex flex-wrap gap-3">
      {totals.map((t) => (
        <dl key={t.currency} className="min-w-56 rounded-md border-2 border-line bg-paper px-4 py-3" data-testid={`total-${t.currency}`}>
          <dt className="text-sm font-bold uppercase tracking-wide text-ink-soft">{t.currency} · {plural(t.count, 'compensation')}</dt>
          <dd className="text-2xl font-bold">{formatMoney(t.amountMinor, t.currency)}</dd>
          <dd className="text-sm">Paid {formatMoney(t.paidMinor, t.currency)} · owed {formatMoney(t.owedMinor, t.currency)}</dd>
          {t.lostMinor > 0 && <dd className="text-sm font-bold text-alert">⚠ {formatMoney(t.lostMinor, t.currency)} of it had a payment voided, canceled or refused: re-issue</dd>}
        </dl>
      ))}
      <p className="self-end text-sm text-ink-soft">{plural(total, 'row')} in all. A voided, canceled or refused payment leaves the passenger owed.</p>
    </section>
  );
}

/** The same totals per medium: drawers and cheques at the counters, transfers and cards at the provider, credits outstanding. */
export function MediumTotals({ byMedium }: { byMedium: LedgerResponse['byMedium'] }) {
  if (!byMedium.length) return null;
  return (
    <table className="mt-3 border-collapse text-left" data-testid="medium-totals">
      <caption className="text-left font-bold">By medium</caption>
      <thead>
        <tr>
          {['Medium', 'Currency', 'Rows', 'Paid', 'Owed'].map((h) => (
            <th key={h} scope="col" className="border-b-2 border-line p-2">{h}</th>
          ))}
        </tr>
      </thead>
      <tbody>
        {byMedium.map((t) => (
          <tr key={`${t.medium}-${t.currency}`}>
            <td className="p-2">{MEDIUM_LABELS[t.medium]}</td>
            <td className="p-2">{t.currency}</td>
            <td className="p-2 tabular-nums">{t.count}</td>
            <td className="p-2 tabular-nums">{formatMoney(t.paidMinor, t.currency)}</td>
            <td className="p-2 tabular-nums">{formatMoney(t.owedMinor, t.currency)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
