import { useId, useState } from 'react';
import type { DeskCompensation } from '@shared/schemas/finance';
import { voucherAgreementBodySchema } from '@shared/schemas/finance';
import { Button } from '../../../components/ui/button';
import { formatMoney } from '../../../lib/format';
import { useOfferVoucher, useRecordVoucherAgreement } from '../api/compensations';
import { Problem } from './problem';

/**
 * A travel voucher instead of the cash-equivalent card, only where the rules allow it: the passenger first sees the
 * cash amount they are entitled to and the voucher's restrictions, and only then is their agreement recorded.
 */
export function VoucherPath({ flightId, compensation: c, step }: { flightId: number; compensation: DeskCompensation; step: 'offer' | 'agree' | 'agreed' }) {
  const v = c.voucher;
  const cash = formatMoney(v.cashAmountMinor, v.currency);
  return (
    <details className="mt-4 rounded-md border-2 border-line bg-paper p-3" open={step === 'agree'} data-testid="voucher-path">
      <summary className="cursor-pointer text-lg font-bold text-harbour">
        {step === 'agreed' ? 'Travel voucher: the passenger agreed' : 'Passenger prefers a travel voucher?'}
      </summary>
      <div className="mt-3 space-y-3 text-lg">
        <p>
          The passenger is entitled to <strong>{cash}</strong> as a cash-equivalent card. A voucher is only their choice, never the default.
        </p>
        <p className="text-ink-soft">{v.rule}</p>
        <div>
          <p className="font-bold">The voucher’s restrictions</p>
          {v.restrictions.length ? (
            <ul className="ml-6 list-disc">
              {v.restrictions.map((r) => (
                <li key={r}>{r}</li>
              ))}
            </ul>
          ) : (
            <p className="text-ink-soft">The station lists no restrictions.</p>
          )}
        </div>
        {step === 'offer' && <OfferStep flightId={flightId} id={c.id} />}
        {step === 'agree' && (
          <>
            <p>
              <span aria-hidden>✓ </span>Shown{v.offerSentTo ? ` and sent to ${v.offerSentTo}` : ' (no e-mail on the booking, so shown only)'}.
            </p>
            <AgreementStep flightId={flightId} id={c.id} cash={cash} />
          </>
        )}
        {step === 'agreed' && v.agreedAt && (
          <p className="font-bold text-calm">
            <span aria-hidden>✓ </span>Agreement recorded; the compensation is issued as a travel voucher.
          </p>
        )}
      </div>
    </details>
  );
}

function OfferStep({ flightId, id }: { flightId: number; id: number }) {
  const offer = useOfferVoucher(flightId);
  return (
    <div>
      <Button variant="secondary" onClick={() => offer.mutate(id)} disabled={offer.isPending}>
        {offer.isPending ? 'Sending…' : 'I showed the passenger these terms: send them a copy'}
      </Button>
      <Problem error={offer.error} />
    </div>
  );
}

function AgreementStep({ flightId, id, cash }: { flightId: number; id: number; cash: string }) {
  const record = useRecordVoucherAgreement(flightId);
  const [statement, setStatement] = useState('');
  const [agreed, setAgreed] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const statementId = useId();

  const submit = () => {
    const parsed = voucherAgreementBodySchema.safeParse({ agreed, statement });
    if (!parsed.success) {
      setError(parsed.error.issues.map((i) => i.message).join('; '));
      return;
    }
    setError(null);
    record.mutate({ id, ...parsed.data });
  };

  return (
    <div className="space-y-2">
      <label htmlFor={statementId} className="block font-bold">
        What the passenger agreed to, in their words
      </label>
      <textarea
        id={statementId}
        value={statement}
        onChange={(e) => setStatement(e.target.value)}
        rows={3}
        maxLength={1000}
        placeholder={`I choose a travel voucher instead of ${cash}, knowing its restrictions.`}
        className="w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg focus:border-harbour"
      />
      <label className="flex items-center gap-2">
        <input type="checkbox" checked={agreed} onChange={(e) => setAgreed(e.target.checked)} className="size-5" />
        The passenger agreed to a voucher instead of {cash}
      </label>
      {error && (
        <p role="alert" className="font-bold text-alert">
          {error}
        </p>
      )}
      <Button onClick={submit} disabled={record.isPending}>
        {record.isPending ? 'Recording…' : 'Record the passenger’s agreement'}
      </Button>
      <Problem error={record.error} />
    </div>
  );
}
