import { useState, type FormEvent } from 'react';
import { changeDenialsBodySchema, type DenialCandidates, type DenialProposal } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { useChangeDenials } from '../api/denials';

interface Props {
  proposal: DenialProposal;
  flightId: number;
  candidates: DenialCandidates['candidates'];
  onDone: () => void;
}

/** Take bookings out of the selection or put others in; the reason is required and recorded on each change. */
export function ChangeSelectionForm({ proposal, flightId, candidates, onDone }: Props) {
  const [remove, setRemove] = useState<number[]>([]);
  const [add, setAdd] = useState<number[]>([]);
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const change = useChangeDenials(flightId);
  const waiting = proposal.denials.filter((d) => d.status === 'proposed');
  const free = candidates.filter((c) => c.selection === null);
  const toggle = (list: number[], id: number) => (list.includes(id) ? list.filter((x) => x !== id) : [...list, id]);

  async function submit(e: FormEvent) {
    e.preventDefault();
    const body = changeDenialsBodySchema.safeParse({ remove, add: [...new Set(add)], reason });
    if (!body.success) {
      setErrors(Object.fromEntries(body.error.issues.map((i) => [String(i.path[0] ?? 'form'), i.message])));
      return;
    }
    setErrors({});
    try {
      await change.mutateAsync({ proposalId: proposal.id, ...body.data });
      onDone();
    } catch (err) {
      const details = err instanceof ApiRequestError ? err.body.details : undefined;
      setErrors(details?.length ? Object.fromEntries(details.map((d) => [d.field, d.rule])) : { form: err instanceof Error ? err.message : 'Not changed.' });
    }
  }

  return (
    <form onSubmit={submit} noValidate className="mt-3 space-y-3 rounded-md bg-paper p-3" aria-label="Change the selection">
      <fieldset>
        <legend className="font-bold">Take out of the selection</legend>
        {waiting.length === 0 && <p className="text-sm text-ink-soft">Nothing waiting to take out.</p>}
        {waiting.map((d) => (
          <label key={d.id} className="flex items-center gap-2 py-1">
            <input type="checkbox" className="h-5 w-5" checked={remove.includes(d.id)} onChange={() => setRemove(toggle(remove, d.id))} />
            #{d.position} {d.pnr} {d.names.join(', ')}
          </label>
        ))}
      </fieldset>
      <fieldset>
        <legend className="font-bold">Put in instead (next in the ranking first)</legend>
        {free.length === 0 && <p className="text-sm text-ink-soft">Nobody else can be selected.</p>}
        {free.map((c) => (
          <label key={c.unitId} className="flex items-center gap-2 py-1">
            <input type="checkbox" className="h-5 w-5" checked={add.includes(c.bookingId)} onChange={() => setAdd(toggle(add, c.bookingId))} />
            #{c.position} {c.pnr} {c.names.join(', ')} ({c.seatsFreed} seat{c.seatsFreed === 1 ? '' : 's'})
          </label>
        ))}
      </fieldset>
      {errors.remove && <p role="alert" className="font-bold text-alert">{errors.remove}</p>}
      {errors.add && <p role="alert" className="font-bold text-alert">{errors.add}</p>}
      <TextField label="Reason for the change (required)" value={reason} onChange={setReason} error={errors.reason} hint="e.g. “passenger travelling to a funeral; next in line instead”." />
      {errors.form && <p role="alert" className="font-bold text-alert">{errors.form}</p>}
      <Button type="submit" disabled={change.isPending}>
        {change.isPending ? 'Saving…' : 'Save the change'}
      </Button>
    </form>
  );
}
