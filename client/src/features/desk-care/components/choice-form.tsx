import { useId, useState, type FormEvent } from 'react';
import type { ChoiceKind } from '@shared/compensation/choice-rules';
import type { PassengerCare } from '@shared/schemas/care';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { useRecordChoice } from '../api/desk-care';

/** The choices the station's rule offers, in its own order; the passenger picks, the agent records. */
export function ChoiceForm({ flightId, passenger: p }: { flightId: number; passenger: PassengerCare }) {
  const [kind, setKind] = useState<ChoiceKind | ''>('');
  const [note, setNote] = useState('');
  const [error, setError] = useState('');
  const record = useRecordChoice(flightId);
  const name = useId();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!kind) {
      setError('Choose what the passenger asked for.');
      return;
    }
    setError('');
    record.mutate({ compensationId: p.compensationId, kind, note }, { onError: (err) => setError(err instanceof ApiRequestError ? err.message : 'The choice could not be recorded.') });
  };
  return (
    <form onSubmit={submit} noValidate className="mt-1 space-y-2">
      <fieldset>
        <legend className="sr-only">What {p.passengerName} chose</legend>
        {p.offers.map((o) => (
          <label key={o.kind} className="flex gap-2 py-1">
            <input type="radio" name={name} value={o.kind} checked={kind === o.kind} onChange={() => setKind(o.kind)} className="mt-1" />
            <span>
              <strong>{o.label}</strong>
              <span className="block text-sm text-ink-soft">{o.detail} ({o.source}{o.basis !== 'regulation' ? ', our reading' : ''})</span>
            </span>
          </label>
        ))}
      </fieldset>
      <TextField label="Note (optional)" value={note} onChange={setNote} hint="For example the later date the passenger wants." />
      {error && <p role="alert" className="font-bold text-alert">{error}</p>}
      <Button type="submit" disabled={record.isPending}>Record the choice</Button>
    </form>
  );
}
