import { useEffect, useRef, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { ReconciliationRun } from '@shared/schemas/finance';
import { Button } from '../../../components/ui/button';
import { Caution, Panel } from '../../../components/ui/page';
import { runQueryOptions, runsQueryOptions, useStartReconciliation } from '../api/finance-api';
import { DifferenceList } from './difference-list';
import { MediumReconciliationTable } from './medium-reconciliation-table';
import { SelectField, type StationOption } from './field';

const STATUS_WORDS: Record<ReconciliationRun['status'], string> = { running: 'Running', completed: 'Completed', failed: 'Failed', interrupted: 'Interrupted' };
const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
const when = (iso: string) => new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(iso));

/** `justStarted`: the run the user started here, whose line takes the focus the Start button gives up while it works. */
function RunDetail({ runId, justStarted }: { runId: number; justStarted: boolean }) {
  const { data, error } = useQuery(runQueryOptions(runId));
  const status = useRef<HTMLParagraphElement>(null);
  const loaded = Boolean(data);
  useEffect(() => {
    if (justStarted && loaded) status.current?.focus();
  }, [justStarted, loaded, runId]);
  if (error) return <p role="alert" className="font-bold text-alert">{error.message}</p>;
  if (!data) return <p className="text-ink-soft">Loading the run…</p>;
  const { run, differences } = data;
  return (
    <Panel title={`Run ${run.id} · ${run.stations.join(', ')}`}>
      <p ref={status} tabIndex={-1} aria-live="polite" data-testid="run-status">
        <strong>{STATUS_WORDS[run.status]}</strong>: {plural(run.pagesRead, 'page')} read, {plural(run.cardsSeen, 'card')} at the provider
        {run.status !== 'running' && `, ${plural(run.ledgerRows, 'compensation')} in the ledger, ${plural(run.differences, 'difference')} (${run.unresolved} open)`}.
      </p>
      {run.error && <p role="alert" className="font-bold text-alert">{run.error}</p>}
      {run.status === 'completed' && <div className="mt-3 overflow-x-auto"><MediumReconciliationTable lines={run.byMedium} /></div>}
      {run.status === 'completed' && <div className="mt-3"><DifferenceList runId={run.id} differences={differences} /></div>}
    </Panel>
  );
}

export function ReconciliationScreen({ stations }: { stations: StationOption[] }) {
  const [stationId, setStationId] = useState<number | null>(null);
  const [selected, setSelected] = useState<number | null>(null);
  const [started, setStarted] = useState<number | null>(null);
  const runs = useQuery(runsQueryOptions());
  const start = useStartReconciliation();
  const shown = selected ?? runs.data?.runs[0]?.id ?? null;
  return (
    <div className="space-y-4">
      <Panel title="Compare the ledger with the provider">
        <div className="flex flex-wrap items-end gap-3">
          <SelectField label="Stations" value={stationId === null ? '' : String(stationId)} onChange={(v) => setStationId(v ? Number(v) : null)}>
            <option value="">All my stations</option>
            {stations.map((s) => <option key={s.id} value={s.id}>{s.iata} · {s.name}</option>)}
          </SelectField>
          <Button type="button" disabled={start.isPending} onClick={() => start.mutate(stationId, { onSuccess: (r) => { setSelected(r.run.id); setStarted(r.run.id); } })}>
            Start reconciliation
          </Button>
        </div>
        {start.error && <p role="alert" className="mt-2 font-bold text-alert">{start.error.message}</p>}
        <p className="mt-2 text-sm text-ink-soft">Compares each medium with its own record: cards and bank transfers at the payment provider (read page by page), cash and cheques with the drawers and the cheque register, and shows the travel credits still outstanding.</p>
      </Panel>
      <Caution />
      {shown !== null && <RunDetail runId={shown} justStarted={shown === started} />}
      <Panel title="Past runs">
        {runs.isPending && <p className="text-ink-soft">Loading…</p>}
        {runs.data && !runs.data.runs.length && <p className="text-ink-soft">No reconciliation has been run yet.</p>}
        {runs.data && runs.data.runs.length > 0 && (
          <table className="w-full border-collapse text-left">
            <thead className="bg-harbour-soft"><tr>{['Run', 'Stations', 'Started', 'By', 'Status', 'Differences', ''].map((h, i) => <th key={i} scope="col" className="p-2">{h}</th>)}</tr></thead>
            <tbody>
              {runs.data.runs.map((r) => (
                <tr key={r.id} className={`border-t border-line ${r.id === shown ? 'bg-signal/30' : ''}`}>
                  <td className="p-2 font-bold">{r.id}</td>
                  <td className="p-2">{r.stations.join(', ')}</td>
                  <td className="p-2">{when(r.startedAt)}</td>
                  <td className="p-2">{r.startedBy}</td>
                  <td className="p-2">{STATUS_WORDS[r.status]}</td>
                  <td className="p-2">{r.status === 'completed' ? `${r.differences} (${r.unresolved} open)` : '—'}</td>
                  <td className="p-2"><Button type="button" variant="quiet" onClick={() => setSelected(r.id)} aria-label={`Show run ${r.id}`}>Show</Button></td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Panel>
    </div>
  );
}
