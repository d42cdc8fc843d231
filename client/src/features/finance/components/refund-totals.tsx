import type { LedgerResponse } from '@shared/schemas/finance';
import { formatMoney } from '../../../lib/format';

/** Refunds the rules add beside compensation (fees not received, downgrades): totalled apart, never in the compensation totals. */
export function RefundTotals({ refundTotals }: { refundTotals: LedgerResponse['refundTotals'] }) {
  if (!refundTotals.length) return null;
  return (
    <section aria-label="Refunds beside compensation, per currency" className="flex flex-wrap gap-3" data-testid="refund-totals">
      {refundTotals.map((t) => (
        <dl key={t.currency} className="min-w-56 rounded-md border-2 border-dashed border-line bg-paper px-4 py-3">
          <dt className="text-sm font-bold uppercase tracking-wide text-ink-soft">{t.currency} · {t.count} {t.count === 1 ? 'refund' : 'refunds'} beside compensation</dt>
          <dd className="text-2xl font-bold">{formatMoney(t.amountMinor, t.currency)}</dd>
          <dd className="text-sm">Paid {formatMoney(t.paidMinor, t.currency)} · owed {formatMoney(t.owedMinor, t.currency)}</dd>
        </dl>
      ))}
    </section>
  );
}
