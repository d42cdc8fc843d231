import { useState, type FormEvent } from 'react';
import { proposeDenialsBodySchema } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { useProposeDenials } from '../api/denials';

interface Props {
  flightId: number;
  /** The live shortfall not yet covered by a waiting proposal: the prefilled seats. */
  suggested: number;
  waitingProposalId: number | null;
  selectable: number;
}

/** The agent asks a supervisor to authorize denials: the system picks who, in the station's priority order. */
export function ProposeDenialsForm({ flightId, suggested, waitingProposalId, selectable }: Props) {
  // Follows the live shortfall until the agent types a number of their own.
  const [typedSeats, setTypedSeats] = useState<string | null>(null);
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const propose = useProposeDenials(flightId);
  const seats = typedSeats ?? String(Math.max(1, suggested));

  async function submit(e: FormEvent) {
    e.preventDefault();
    const body = proposeDenialsBodySchema.safeParse({ seatsNeeded: Number(seats), reason });
    if (!body.success) {
      setErrors(Object.fromEntries(body.error.issues.map((i) => [String(i.path[0] ?? 'form'), i.message])));
      return;
    }
    setErrors({});
    try {
      const proposal = await propose.mutateAsync(body.data);
      setReason('');
      setTypedSeats(null);
      setDone(`Proposed: ${proposal.seatsSelected} seat${proposal.seatsSelected === 1 ? '' : 's'} in ${proposal.denials.length} booking${proposal.denials.length === 1 ? '' : 's'}. A supervisor has been told.`);
    } catch (err) {
      const details = err instanceof ApiRequestError ? err.body.details : undefined;
      setErrors(details?.length ? Object.fromEntries(details.map((d) => [d.field, d.rule])) : { form: err instanceof Error ? err.message : 'The proposal was not made.' });
    }
  }

  if (waitingProposalId !== null) {
    return (
      <div className="space-y-2">
        {done && <p role="status" className="font-bold text-calm"><span aria-hidden>✓ </span>{done}</p>}
        <p className="rounded-md bg-watch-soft px-3 py-2">Proposal {waitingProposalId} waits for a supervisor. It can be changed or withdrawn in the bump review.</p>
      </div>
    );
  }
  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label="Propose denials">
      <div className="grid gap-3 sm:grid-cols-[10rem_1fr]">
        <TextField label="Seats needed" inputMode="numeric" value={seats} onChange={setTypedSeats} error={errors.seatsNeeded} hint={`Live shortfall: ${suggested}`} />
        <TextField label="Reason" value={reason} onChange={setReason} error={errors.reason} hint="Recorded with the proposal, e.g. “2 short after the volunteer round closed”." />
      </div>
      {errors.form && <p role="alert" className="font-bold text-alert">{errors.form}</p>}
      <Button type="submit" variant="danger" disabled={propose.isPending || selectable === 0}>
        {propose.isPending ? 'Proposing…' : 'Propose denials'}
      </Button>
      {selectable === 0 && <p className="text-sm text-ink-soft">Nobody can be selected: every passenger is protected, boarded, a volunteer or already selected.</p>}
    </form>
  );
}
