import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';

/** A consequential step with money: the reason is asked for, and kept with the change. */
export function ReasonForm({ label, submitLabel, error, busy, onSubmit, onCancel }: {
  label: string;
  submitLabel: string;
  error?: string;
  busy: boolean;
  onSubmit: (reason: string) => void;
  onCancel: () => void;
}) {
  const [reason, setReason] = useState('');
  const [tried, setTried] = useState(false);
  const tooShort = reason.trim().length < 3;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTried(true);
    if (!tooShort) onSubmit(reason.trim());
  };
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-2">
      <TextField label={label} value={reason} onChange={setReason} maxLength={200} className="min-w-64 flex-1" error={(tried && tooShort ? 'Say why, in at least 3 characters.' : undefined) ?? error} />
      <Button type="submit" variant="danger" disabled={busy}>
        {submitLabel}
      </Button>
      <Button type="button" variant="quiet" onClick={onCancel}>
        Cancel
      </Button>
    </form>
  );
}
