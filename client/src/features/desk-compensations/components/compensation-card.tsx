import { bandLabel } from '@shared/compensation/labels';
import { isPaymentLost, type DeskCompensation } from '@shared/schemas/finance';
import { Button } from '../../../components/ui/button';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
import { isRefundPayment } from '@shared/schemas/refunds';
import { formatMoney, formatTimeWithZone } from '../../../lib/format';
import { useIssueCompensation } from '../api/compensations';
import { paymentStep } from '../model/payment-step';
import { kindLabel, STATE_LOOK, TONE_CLASS } from '../model/words';
import { AgreementForm } from './agreement-form';
import { CounterPaymentForm } from './counter-payment-form';
import { MediumChoice } from './medium-choice';
import { NewLinkButton } from './new-link-button';
import { Problem } from './problem';
import { ReceiptDialog } from './receipt-dialog';
import { ReissueForm } from './reissue-form';

/** One passenger's compensation: who, why, how much, in what medium and by when, where it stands, and how it is paid. */
export function CompensationCard({ flightId, compensation: c }: { flightId: number; compensation: DeskCompensation }) {
  const issue = useIssueCompensation(flightId);
  const look = STATE_LOOK[c.state];
  const amount = formatMoney(c.amountMinor, c.currency);
  const step = paymentStep(c);
  const overdue = c.payment.terms.dueStatus === 'overdue';
  const soon = c.payment.terms.dueStatus === 'due-soon';
  const refund = isRefundPayment(c.sourceKind);

  return (
    <article data-testid="compensation-row" data-state={c.state} data-pnr={c.pnr} aria-label={`Compensation for ${c.passengerName}`} className="rounded-lg border-2 border-line p-4">
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h3 className="text-xl font-bold">
            {c.passengerName} <span className="font-normal text-ink-soft">· booking {c.pnr}</span>
          </h3>
          <p className="text-lg">{kindLabel(c)}</p>
        </div>
        <div className="text-right">
          <p className="text-3xl font-bold" data-testid="compensation-amount">
            {amount}
          </p>
          <p data-testid="compensation-state" className={`mt-1 inline-block rounded-md border-2 px-3 py-1 text-lg font-bold ${TONE_CLASS[look.tone]}`}>
            <span aria-hidden>{look.icon} </span>
            {look.text}
          </p>
        </div>
      </header>
      <dl className="mt-3 grid gap-x-6 gap-y-1 text-lg sm:grid-cols-[max-content_1fr]">
        <dt className="font-bold">Basis</dt>
        <dd>
          {refund ? 'Refund' : bandLabel(c.band, c.serviceDate)} ({c.ruleRef})
        </dd>
        <dt className="font-bold">Why</dt>
        <dd>{refund ? 'A refund the station’s rule adds to this passenger’s compensation; paid on its own, in the same media.' : c.voluntary ? 'The volunteer agreed this amount in exchange for the seat.' : 'Set by the station’s regulation for an involuntary denial of boarding.'}</dd>
        <dt className="font-bold">Paid in</dt>
        <dd data-testid="compensation-medium">{MEDIUM_LABELS[c.medium]}</dd>
        {c.dueBy && (
          <>
            <dt className="font-bold">Due by</dt>
            <dd data-testid="compensation-due-by" className={overdue ? 'font-bold text-alert' : soon ? 'font-bold text-watch' : ''}>
              {(overdue || soon) && <span aria-hidden>⚠ </span>}
              {formatTimeWithZone(c.dueBy, c.payment.terms.timeZone)}
              {overdue ? ' — overdue' : soon ? ' — due soon' : ''} ({c.payment.terms.ruleRef})
            </dd>
          </>
        )}
        <dt className="font-bold">Status</dt>
        <dd>{look.detail}</dd>
        {c.lastError && (
          <>
            <dt className="font-bold text-alert">Provider said</dt>
            <dd className="text-alert">{c.lastError}</dd>
          </>
        )}
        {c.voidReason && (
          <>
            <dt className="font-bold">Why it was voided</dt>
            <dd>{c.voidReason}</dd>
          </>
        )}
        {c.provider?.last4 && (
          <>
            <dt className="font-bold">Card</dt>
            <dd>ending {c.provider.last4}</dd>
          </>
        )}
      </dl>
      {c.state === 'due' && c.amountMinor > 0 && <MediumChoice flightId={flightId} compensation={c} />}
      {step === 'counter' && <CounterPaymentForm flightId={flightId} compensation={c} />}
      {step === 'agree' && <AgreementForm flightId={flightId} compensation={c} />}
      {step === 'issue' && (
        <div className="mt-4">
          <Button onClick={() => issue.mutate(c.id)} disabled={issue.isPending} className="text-lg">
            {issue.isPending ? 'Issuing…' : `Issue ${amount} as: ${MEDIUM_LABELS[c.medium]}`}
          </Button>
          <Problem error={issue.error} />
        </div>
      )}
      {c.payment.passengerLink && <NewLinkButton flightId={flightId} compensationId={c.id} link={c.payment.passengerLink} timeZone={c.payment.terms.timeZone} />}
      {isPaymentLost(c.state) && c.amountMinor > 0 && <ReissueForm flightId={flightId} compensationId={c.id} amount={amount} />}
      {(step === 'paid-counter' || c.payment.agreement) && (
        <div className="mt-4">
          <ReceiptDialog compensationId={c.id} />
        </div>
      )}
    </article>
  );
}
