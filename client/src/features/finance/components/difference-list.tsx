import { useState, type FormEvent } from 'react';
import { DIFFERENCE_LABELS, type ReconciliationDifference } from '@shared/schemas/finance';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
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

/** The other side of a medium's comparison, in the words finance uses for it. */
function otherSide(medium: ReconciliationDifference['medium']): { side: string; ref: string } {
  if (medium === 'cash' || medium === 'cheque') return { side: 'Register', ref: '' };
  if (medium === 'bank-transfer') return { side: 'Provider', ref: 'transfer ' };
  return { side: 'Provider', ref: 'card ' };
}

export function DifferenceList({ runId, differences }: { runId: number; differences: ReconciliationDifference[] }) {
  if (!differences.length) return <p className="rounded-md bg-calm-soft px-3 py-2 font-bold text-calm">✓ No differences: the ledger, the provider and the counter register agree.</p>;
  return (
    <ul className="space-y-3" aria-label="Differences">
      {differences.map((d) => {
        const other = otherSide(d.medium);
        return (
        <li key={d.id} className="rounded-md border-2 border-line bg-paper p-3" data-testid="difference">
          <p className="font-bold">
            {d.medium && <span>{MEDIUM_LABELS[d.medium]}: </span>}
            {DIFFERENCE_LABELS[d.kind]}
            {d.compensationId !== null && <span className="font-normal"> · compensation {d.compensationId}</span>}
            {d.cardId && <span className="font-normal text-ink-soft"> · {other.ref}{d.cardId}</span>}
          </p>
          <p>Ledger: <strong>{d.ledgerValue ?? '—'}</strong> · {other.side}: <strong>{d.providerValue ?? '—'}</strong></p>
          {d.resolvedAt ? (
            <p className="text-calm">✓ Resolved by {d.resolvedBy}: {d.note}</p>
          ) : (
            <ResolveForm runId={runId} difference={d} />
          )}
        </li>
        );
      })}
    </ul>
  );
}
