import { useState, type FormEvent } from 'react';
import { withdrawDenialsBodySchema } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { useWithdrawProposal } from '../api/denials';

export function WithdrawForm({ proposalId, flightId, onDone }: { proposalId: number; flightId: number; onDone: () => void }) {
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | undefined>();
  const withdraw = useWithdrawProposal(flightId);

  async function submit(e: FormEvent) {
    e.preventDefault();
    const body = withdrawDenialsBodySchema.safeParse({ reason });
    if (!body.success) {
      setError(body.error.issues[0].message);
      return;
    }
    try {
      await withdraw.mutateAsync({ proposalId, reason: body.data.reason });
      onDone();
    } catch (err) {
      setError(err instanceof Error ? err.message : 'Not withdrawn.');
    }
  }

  return (
    <form onSubmit={submit} noValidate className="mt-3 space-y-2 rounded-md bg-paper p-3" aria-label="Withdraw the proposal">
      <TextField label="Why withdraw?" value={reason} onChange={setReason} error={error} hint="Recorded with the decision." />
      <Button type="submit" variant="danger" disabled={withdraw.isPending}>
        Withdraw the proposal
      </Button>
    </form>
  );
}
