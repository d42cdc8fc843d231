import { useState, type FormEvent } from 'react';
import { DIFFERENCE_LABELS, type ReconciliationDifference } from '@shared/schemas/finance';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { useResolveDifference } from '../api/finance-api';

function ResolveForm({ runId, difference }: { runId: number; difference: ReconciliationDifference }) {
  const [note, setNote] = useState('');
  const resolve = useResolveDifference(runId);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    resolve.mutate({ differenceId: difference.id, note: note.trim() });
  };
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-2">
      <TextField label="How it was resolved" value={note} onChange={setNote} maxLength={500} className="min-w-64 flex-1" error={resolve.error?.message} />
      <Button type="submit" variant="secondary" disabled={resolve.isPending || note.trim().length < 3}>Resolve</Button>
    </form>
  );
}

export function DifferenceList({ runId, differences }: { runId: number; differences: ReconciliationDifference[] }) {
  if (!differences.length) return <p className="rounded-md bg-calm-soft px-3 py-2 font-bold text-calm">✓ No differences: the ledger and the provider agree.</p>;
  return (
    <ul className="space-y-3" aria-label="Differences">
      {differences.map((d) => (
        <li key={d.id} className="rounded-md border-2 border-line bg-paper p-3">
          <p className="font-bold">
            {DIFFERENCE_LABELS[d.kind]}
            {d.compensationId !== null && <span className="font-normal"> · compensation {d.compensationId}</span>}
            {d.cardId && <span className="font-normal text-ink-soft"> · card {d.cardId}</span>}
          </p>
          <p>Ledger: <strong>{d.ledgerValue ?? '—'}</strong> · Provider: <strong>{d.providerValue ?? '—'}</strong></p>
          {d.resolvedAt ? (
            <p className="text-calm">✓ Resolved by {d.resolvedBy}: {d.note}</p>
          ) : (
            <ResolveForm runId={runId} difference={d} />
          )}
        </li>
      ))}
    </ul>
  );
}
