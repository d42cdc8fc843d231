import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { useReissueCompensation } from '../api/compensations';
import { Problem } from './problem';

/**
 * The passenger is still owed after a payment was refused, voided or canceled: a new payment, with the reason kept
 * on record. The server deducts what was already spent on an earlier card, so nothing is paid twice.
 */
export function ReissueForm({ flightId, compensationId, amount }: { flightId: number; compensationId: number; amount: string }) {
  const reissue = useReissueCompensation(flightId);
  const [reason, setReason] = useState('');
  const [tried, setTried] = useState(false);
  const tooShort = reason.trim().length < 3;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTried(true);
    if (!tooShort) reissue.mutate({ id: compensationId, reason: reason.trim() });
  };
  return (
    <form onSubmit={submit} className="mt-4 flex flex-wrap items-end gap-2" aria-label="Re-issue the payment">
      <TextField label="Why issue it again?" value={reason} onChange={setReason} maxLength={200} className="min-w-64 flex-1" error={tried && tooShort ? 'Say why, in at least 3 characters.' : undefined} />
      <Button type="submit" disabled={reissue.isPending} className="text-lg">
        {reissue.isPending ? 'Issuing…' : `Re-issue ${amount}`}
      </Button>
      <div className="basis-full">
        <Problem error={reissue.error} />
      </div>
    </form>
  );
}
