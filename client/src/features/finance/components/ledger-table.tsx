import { useState } from 'react';
import { regimeLabel } from '@shared/compensation/labels';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
import { isPaymentLost, STATE_LABELS, type CompensationView } from '@shared/schemas/finance';
import { refundKindLabel } from '@shared/schemas/refunds';
import { Button } from '../../../components/ui/button';
import { formatMoney } from '../../../lib/format';
import { useCompensationAction } from '../api/finance-api';
import { ReasonForm } from './reason-form';

/** The provider's word on the card, as last reported by its answers and webhooks. */
export function providerStateText(c: CompensationView): string {
  if (!c.provider) return 'Not at the provider';
  if (c.provider.status === 'canceled') return 'Canceled';
  if (c.provider.spentMinor > 0) return `Spent ${formatMoney(c.provider.spentMinor, c.currency)}`;
  return c.provider.status === 'active' ? 'Active card' : `Card ${c.provider.status}`;
}

type Action = 'void' | 'reissue';
const canVoid = (c: CompensationView) => ['due', 'failed', 'issued'].includes(c.state);

function Row({ c }: { c: CompensationView }) {
  const [open, setOpen] = useState<Action | null>(null);
  const action = useCompensationAction();
  return (
    <>
      <tr className="border-t border-line align-top">
        <td className="p-2 font-bold">{c.stationIata}</td>
        <td className="p-2">{c.flight}<br /><span className="text-sm text-ink-soft">{c.serviceDate}</span></td>
        <td className="p-2">{c.passengerName}<br /><span className="text-sm text-ink-soft">{c.pnr}</span></td>
        <td className="p-2">{regimeLabel(c.regime)}<br /><span className="text-sm text-ink-soft">{refundKindLabel(c.sourceKind) ?? (c.voluntary ? 'Volunteer' : 'Involuntary')}</span></td>
        <td className="p-2">
          {MEDIUM_LABELS[c.medium]}
          {c.dueBy && <><br /><span className="text-sm text-ink-soft">due by {c.dueBy.slice(0, 16).replace('T', ' ')} UTC</span></>}
        </td>
        <td className="p-2 text-right font-bold tabular-nums">{formatMoney(c.amountMinor, c.currency)}</td>
        <td className="p-2">{providerStateText(c)}</td>
        <td className="p-2">
          <span className="font-bold">{isPaymentLost(c.state) ? '⚠ ' : ''}{STATE_LABELS[c.state]}</span>
          {isPaymentLost(c.state) && <span className="block text-sm font-bold text-alert">Still owed</span>}
          {c.voidReason && <span className="block text-sm text-ink-soft">{c.voidReason}</span>}
          {c.lastError && c.state !== 'issued' && <span className="block text-sm text-alert">{c.lastError}</span>}
        </td>
        <td className="p-2">
          <div className="flex flex-wrap gap-1">
            {canVoid(c) && <Button type="button" variant="secondary" onClick={() => setOpen('void')} aria-label={`Void compensation ${c.id}`}>Void…</Button>}
            {isPaymentLost(c.state) && <Button type="button" variant="secondary" onClick={() => setOpen('reissue')} aria-label={`Re-issue compensation ${c.id}`}>Re-issue…</Button>}
          </div>
        </td>
      </tr>
      {open && (
        <tr>
          <td colSpan={9} className="bg-paper p-3">
            <ReasonForm
              label={open === 'void' ? `Why void ${formatMoney(c.amountMinor, c.currency)} for ${c.passengerName}?` : `Why re-issue for ${c.passengerName}?`}
              submitLabel={open === 'void' ? (c.state === 'issued' ? 'Cancel the card and void' : 'Void') : 'Re-issue'}
              busy={action.isPending}
              error={action.error?.message}
              onCancel={() => setOpen(null)}
              onSubmit={(reason) => action.mutate({ id: c.id, action: open, reason }, { onSuccess: () => setOpen(null) })}
            />
          </td>
        </tr>
      )}
    </>
  );
}

export function LedgerTable({ rows }: { rows: CompensationView[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[64rem] border-collapse text-left">
        <caption className="sr-only">Compensations</caption>
        <thead className="bg-harbour-soft">
          <tr>
            {['Station', 'Flight', 'Passenger', 'Regime', 'Medium', 'Amount', 'At the provider', 'In the ledger', ''].map((h, i) => (
              <th key={i} scope="col" className={`p-2 ${h === 'Amount' ? 'text-right' : ''}`}>{h}</th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((c) => <Row key={c.id} c={c} />)}
        </tbody>
      </table>
    </div>
  );
}
