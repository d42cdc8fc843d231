import { useId, useState } from 'react';
import { agreementText } from '@shared/compensation/agreement-text';
import type { DeskCompensation } from '@shared/schemas/finance';
import { agreementBodySchema } from '@shared/schemas/payment-media';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { moneyFieldText, readMoneyField } from '../../../lib/money';
import { useOfferVoucher, useRecordAgreement } from '../api/compensations';
import { Problem } from './problem';
import { issueProblems, type FieldProblem } from '../../../components/ui/form-problems';
import { SignaturePad } from './signature-pad';

const VALUE_RULE = { 'at-least': 'at least the cash amount', greater: 'more than the cash amount', any: 'any value the passenger accepts' } as const;

/**
 * A prepaid card or travel credit instead of money: the passenger reads the exact text built from these facts (the
 * server rebuilds and compares it), then signs on the screen. The rule's conditions are named beside the fields.
 */
export function AgreementForm({ flightId, compensation: c }: { flightId: number; compensation: DeskCompensation }) {
  const record = useRecordAgreement(flightId);
  const offer = useOfferVoucher(flightId);
  const medium = c.medium === 'prepaid-card' ? 'prepaid-card' : 'travel-credit';
  const { terms } = c.payment;
  const [valueText, setValueText] = useState(moneyFieldText(c.amountMinor, c.currency));
  const [expires, setExpires] = useState('');
  const [signature, setSignature] = useState<string | null>(null);
  const [refused, setRefused] = useState<FieldProblem[] | null>(null);
  const id = useId();
  const value = readMoneyField(valueText, c.currency, 'valueMinor');
  const valueMinor = value.ok ? value.minor : c.amountMinor;
  const expiresOn = expires === '' ? null : expires;
  const text = agreementText({ passengerName: c.passengerName, flight: c.flight, serviceDate: c.serviceDate, medium, cashAmountMinor: c.amountMinor, valueMinor, currency: c.currency, expiresOn, restrictions: terms.restrictions, ruleRef: terms.ruleRef });

  const submit = () => {
    if (!value.ok) return setRefused([{ field: 'valueMinor', rule: value.message }]);
    const parsed = agreementBodySchema.safeParse({ medium, valueMinor, expiresOn, text, signature: signature ?? '' });
    if (!parsed.success) return setRefused(issueProblems(parsed.error.issues));
    setRefused(null);
    record.mutate({ id: c.id, ...parsed.data });
  };

  return (
    <div className="mt-4 space-y-3 rounded-md border-2 border-line bg-paper p-3 text-lg" data-testid="agreement-form">
      <p className="font-bold">The passenger’s agreement to {medium === 'prepaid-card' ? 'a prepaid card' : 'a travel credit'}</p>
      <p className="text-ink-soft">
        Its value must be {VALUE_RULE[terms.conditions.value]}
        {terms.conditions.noExpiry ? ', and it must not expire' : ''} ({terms.conditions.ruleRef}).
      </p>
      <div className="flex flex-wrap gap-4">
        <TextField id={`${id}-value`} label={`Value to the passenger (${c.currency})`} value={valueText} onChange={setValueText} error={value.ok ? undefined : value.message} />
        {medium === 'travel-credit' && (
          <TextField id={`${id}-expires`} label="Usable until (leave empty if it never expires)" type="date" value={expires} onChange={setExpires} />
        )}
      </div>
      <div>
        <p className="font-bold">What the passenger reads</p>
        <pre data-testid="agreement-text" className="mt-1 whitespace-pre-wrap rounded-md border-2 border-line bg-card p-3 font-sans">{text}</pre>
      </div>
      <Button variant="secondary" type="button" onClick={() => offer.mutate(c.id)} disabled={offer.isPending}>
        {offer.isPending ? 'Sending…' : 'Send the passenger the cash amount and conditions by e-mail'}
      </Button>
      {offer.data && <p>✓ {offer.data.offer.sentTo ? `Sent to ${offer.data.offer.sentTo}` : 'No e-mail on the booking: shown on screen only'}.</p>}
      <Problem error={offer.error} />
      <SignaturePad label="Passenger’s signature" onChange={setSignature} />
      <Button onClick={submit} disabled={record.isPending}>
        {record.isPending ? 'Recording…' : 'Record the signed agreement'}
      </Button>
      <Problem
        error={record.error}
        problems={refused}
        labels={{ valueMinor: `Value to the passenger (${c.currency})`, expiresOn: 'Usable until', signature: 'Passenger’s signature', text: 'What the passenger reads' }}
        fieldIds={{ valueMinor: `${id}-value`, expiresOn: `${id}-expires` }}
      />
    </div>
  );
}
