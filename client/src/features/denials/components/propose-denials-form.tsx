import { useState, type FormEvent } from 'react';
import { proposeDenialsBodySchema, type CabinCounts } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { useProposeDenials } from '../api/denials';

interface Props {
  flightId: number;
  /** Each cabin's live shortfall not yet covered by a waiting proposal: the prefilled seats. */
  byCabin: CabinCounts[];
  waitingProposalId: number | null;
  /** Units not yet selected, per cabin: who could be proposed. */
  selectableIn: (cabin: string) => number;
}

/** The agent asks a supervisor to authorize denials: the system picks who, in the station's priority order. */
export function ProposeDenialsForm({ flightId, byCabin, waitingProposalId, selectableIn }: Props) {
  const short = byCabin.filter((c) => c.seatsShortAfterProposals > 0);
  const [chosenCabin, setChosenCabin] = useState<string | null>(null);
  const cabin = short.find((c) => c.cabin === chosenCabin) ?? short[0] ?? null;
  const suggested = cabin?.seatsShortAfterProposals ?? 0;
  const selectable = cabin ? selectableIn(cabin.cabin) : 0;
  // Follows the live shortfall until the agent types a number of their own.
  const [typedSeats, setTypedSeats] = useState<string | null>(null);
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const propose = useProposeDenials(flightId);
  const seats = typedSeats ?? String(Math.max(1, suggested));

  async function submit(e: FormEvent) {
    e.preventDefault();
    const body = proposeDenialsBodySchema.safeParse({ seatsNeeded: Number(seats), reason, ...(cabin ? { cabin: cabin.cabin } : {}) });
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
  if (cabin === null) {
    return (
      <div className="space-y-2">
        {done && <p role="status" className="font-bold text-calm"><span aria-hidden>✓ </span>{done}</p>}
        <p className="text-ink-soft">
          Nothing to propose: no cabin has more passengers present than seats. Only passengers checked in by the deadline count; the rest are no-shows.
        </p>
      </div>
    );
  }
  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label="Propose denials">
      {short.length > 1 && (
        <fieldset>
          <legend className="font-bold">Cabin</legend>
          <div className="flex flex-wrap gap-4">
            {short.map((c) => (
              <label key={c.cabin} className="flex items-center gap-2 py-1">
                <input type="radio" name="cabin" className="h-5 w-5" checked={c.cabin === cabin.cabin} onChange={() => { setChosenCabin(c.cabin); setTypedSeats(null); }} />
                Cabin {c.cabin}: {c.seatsShortAfterProposals} short
              </label>
            ))}
          </div>
        </fieldset>
      )}
      {errors.cabin && <p role="alert" className="font-bold text-alert">{errors.cabin}</p>}
      <div className="grid gap-3 sm:grid-cols-[10rem_1fr]">
        <TextField label="Seats needed" inputMode="numeric" value={seats} onChange={setTypedSeats} error={errors.seatsNeeded} hint={`Live shortfall in cabin ${cabin.cabin}: ${suggested}`} />
        <TextField label="Reason" value={reason} onChange={setReason} error={errors.reason} hint="Recorded with the proposal, e.g. “2 short after the volunteer round closed”." />
      </div>
      {errors.form && <p role="alert" className="font-bold text-alert">{errors.form}</p>}
      <Button type="submit" variant="danger" disabled={propose.isPending || selectable === 0}>
        {propose.isPending ? 'Proposing…' : 'Propose denials'}
      </Button>
      {selectable === 0 && <p className="text-sm text-ink-soft">Nobody in cabin {cabin.cabin} can be selected: every passenger present is boarded, a volunteer or already selected.</p>}
    </form>
  );
}
