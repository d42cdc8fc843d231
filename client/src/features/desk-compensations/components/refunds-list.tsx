import { useQuery } from '@tanstack/react-query';
import { RULE_REFUND_LABELS } from '@shared/schemas/refunds';
import { STATE_LABELS } from '@shared/schemas/finance';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
import { Caution } from '../../../components/ui/page';
import { formatMoney } from '../../../lib/format';
import { refundsQueryOptions } from '../api/refunds';

/**
 * The refunds the rules add beside each compensation (fees for services not received, a downgrade), each with its
 * rule. Each is paid from its own card in the list above, through the same media as the compensation.
 */
export function RefundsList({ flightId }: { flightId: number }) {
  const list = useQuery(refundsQueryOptions(flightId));
  const refunds = list.data?.refunds ?? [];
  if (list.isPending || (!list.error && refunds.length === 0)) return null;
  return (
    <section data-testid="desk-refunds" aria-labelledby="desk-refunds-title" className="rounded-lg border-2 border-line p-4">
      <h3 id="desk-refunds-title" className="text-xl font-bold">
        Refunds beside compensation
      </h3>
      <div className="mt-2">
        <Caution>
          Bumpboard computes these refunds from the fees and cabin recorded on the booking under the configured rules. Whether a service was received
          on the alternate, the applicable regulation, the contract of carriage and the carrier’s compliance staff decide what is refunded.
        </Caution>
      </div>
      {list.error && (
        <p role="alert" className="mt-2 font-bold text-alert">
          The refunds could not be loaded: {list.error.message}
        </p>
      )}
      <ul className="mt-3 space-y-3">
        {refunds.map((r) => (
          <li key={r.id} data-testid="refund-row" data-kind={r.kind} className="rounded-md border-2 border-line p-3">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <p className="text-lg">
                <strong>{r.passengerName}</strong> · {RULE_REFUND_LABELS[r.kind]}
              </p>
              <p className="text-2xl font-bold" data-testid="refund-amount">
                {formatMoney(r.amountMinor, r.currency)}
              </p>
            </div>
            <ul className="mt-1 text-lg">
              {r.lines.map((l) => (
                <li key={l.label}>
                  {l.label}: {formatMoney(l.amountMinor, r.currency)}
                </li>
              ))}
            </ul>
            <p className="mt-1 text-ink-soft">Rule: {r.ruleRef}</p>
            <p className="mt-1">
              Payment: <strong>{STATE_LABELS[r.paymentState]}</strong>, {MEDIUM_LABELS[r.medium]} (paid from its own entry above, no. {r.paymentCompensationId})
            </p>
          </li>
        ))}
      </ul>
    </section>
  );
}
