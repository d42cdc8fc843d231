import { useId, useState } from 'react';
import type { DeskCompensation } from '@shared/schemas/finance';
import { counterPaymentBodySchema } from '@shared/schemas/payment-media';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { formatMoney } from '../../../lib/format';
import { usePayAtCounter } from '../api/compensations';
import { Problem } from './problem';
import { issueProblems, type FieldProblem } from '../../../components/ui/form-problems';
import { SignaturePad } from './signature-pad';

/** Cash from a named drawer or a numbered cheque, exactly the amount owed, with the passenger's signature on the receipt. */
export function CounterPaymentForm({ flightId, compensation: c }: { flightId: number; compensation: DeskCompensation }) {
  const pay = usePayAtCounter(flightId);
  const medium = c.medium === 'cheque' ? 'cheque' : 'cash';
  const [reference, setReference] = useState('');
  const [signature, setSignature] = useState<string | null>(null);
  const [refused, setRefused] = useState<FieldProblem[] | null>(null);
  const id = useId();
  const amount = formatMoney(c.amountMinor, c.currency);

  const submit = () => {
    // Nothing typed is a missing field (one problem, "is required"), not also an empty one.
    const body = { medium, amountMinor: c.amountMinor, signature: signature ?? '', ...(reference === '' ? {} : medium === 'cash' ? { drawerId: reference } : { chequeNumber: reference }) };
    const parsed = counterPaymentBodySchema.safeParse(body);
    if (!parsed.success) return setRefused(issueProblems(parsed.error.issues));
    setRefused(null);
    pay.mutate({ id: c.id, ...parsed.data });
  };

  return (
    <div className="mt-4 space-y-3 rounded-md border-2 border-line bg-paper p-3 text-lg" data-testid="counter-payment-form">
      <p className="font-bold">
        Hand over {amount} {medium === 'cash' ? 'in cash' : 'by cheque'}
      </p>
      <TextField id={`${id}-reference`} label={medium === 'cash' ? 'Drawer the cash comes from' : 'Cheque number'} value={reference} onChange={setReference} maxLength={32} />
      <p>
        Receipt: {c.passengerName}, booking {c.pnr}, flight {c.flight} on {c.serviceDate}: {amount} {medium === 'cash' ? 'in cash' : 'by cheque'} ({c.ruleRef}).
      </p>
      <SignaturePad label="Passenger’s signature: received the amount above" onChange={setSignature} />
      <Button onClick={submit} disabled={pay.isPending}>
        {pay.isPending ? 'Recording…' : `Record ${amount} paid and signed for`}
      </Button>
      <Problem
        error={pay.error}
        problems={refused}
        labels={{ drawerId: 'Drawer the cash comes from', chequeNumber: 'Cheque number', signature: 'Passenger’s signature', amountMinor: 'Amount' }}
        fieldIds={{ drawerId: `${id}-reference`, chequeNumber: `${id}-reference` }}
      />
    </div>
  );
}
