import { useId, useState, type ChangeEvent } from 'react';
import { MANIFEST_ALL_COLUMNS, MANIFEST_COLUMN_HELP, MANIFEST_MAX_BYTES } from '@shared/schemas/manifest';
import { Button } from '../../../components/ui/button';
import { manifestTemplateUrl, ManifestUploadError, useImportManifest, usePreviewManifest } from '../api/manifests';
import type { StationRef } from '../model/station-ref';
import { IndeterminateBar } from './indeterminate-bar';
import { FlightsTable, ImportResult, ProblemsTable } from './manifest-report';

const sizeText = (bytes: number) => (bytes < 1024 ? `${bytes} bytes` : `${(bytes / 1024).toFixed(bytes < 10_240 ? 1 : 0)} KB`);

function ColumnHelp() {
  return (
    <details className="rounded-md border-2 border-line bg-paper px-3 py-2">
      <summary className="cursor-pointer font-bold">What each column holds</summary>
      <dl className="mt-2 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        {MANIFEST_ALL_COLUMNS.map((c) => (
          <div key={c} className="contents">
            <dt className="font-mono font-bold">{c}</dt>
            <dd>{MANIFEST_COLUMN_HELP[c]}</dd>
          </div>
        ))}
      </dl>
    </details>
  );
}

export function ManifestPanel({ station }: { station: StationRef }) {
  const inputId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [confirmed, setConfirmed] = useState(false);
  const confirmId = useId();
  const preview = usePreviewManifest(station.id);
  const runImport = useImportManifest(station.id);

  function choose(e: ChangeEvent<HTMLInputElement>) {
    const chosen = e.target.files?.[0] ?? null;
    if (!chosen) return;
    setFile(chosen);
    setConfirmed(false);
    runImport.reset();
    preview.mutate(chosen);
  }

  const checked = preview.data;
  const importProblems = runImport.error instanceof ManifestUploadError ? runImport.error.problems : [];
  const problems = importProblems.length ? importProblems : (checked?.errors ?? []);
  const ready = Boolean(file && checked && checked.errors.length === 0 && !preview.isPending);
  const passengers = checked?.flights.reduce((n, f) => n + f.passengers, 0) ?? 0;
  const cancels = checked?.flights.reduce((n, f) => n + f.willCancel, 0) ?? 0;

  return (
    <div className="space-y-4">
      <p className="text-ink-soft">
        Upload the passenger list {station.iata} exports from its booking system, one row per passenger. Each file is the full list for the flights it names: a passenger
        already stored but missing from the file is cancelled. Check-in and boarding already recorded are kept.
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <a href={manifestTemplateUrl(station.id)} download className="inline-flex min-h-11 items-center rounded-md border-2 border-harbour bg-card px-4 py-2 font-bold text-harbour hover:bg-harbour-soft">
          Download template
        </a>
        <span className="text-sm text-ink-soft">A CSV with the header and two invented passengers on one of this station’s flights; it imports as it is.</span>
      </div>
      <ColumnHelp />

      <div className="space-y-1">
        <label htmlFor={inputId} className="block font-bold">
          Manifest file (CSV, at most {MANIFEST_MAX_BYTES / 1024 / 1024} MB)
        </label>
        <input
          id={inputId}
          type="file"
          accept=".csv,text/csv"
          onChange={choose}
          // Cleared as the picker opens, so choosing the same file again once it is fixed is still a change.
          onClick={(e) => {
            e.currentTarget.value = '';
          }} className="block text-base file:mr-3 file:min-h-11 file:cursor-pointer file:rounded-md file:border-2 file:border-harbour file:bg-harbour file:px-4 file:font-bold file:text-white" />
        {file && (
          <p className="text-sm">
            Chosen: <strong>{file.name}</strong> ({sizeText(file.size)}). {preview.isPending ? 'Checking…' : 'After fixing the file, choose it again to check it anew.'}
          </p>
        )}
        {preview.error && <p role="alert" className="font-bold text-alert">{preview.error.message}</p>}
      </div>

      {checked && !runImport.isSuccess && (
        <div className="space-y-3">
          <p className="font-bold" role="status">
            {checked.rows} passenger row{checked.rows === 1 ? '' : 's'} read;{' '}
            {checked.errors.length === 0 ? <span className="text-calm">✓ no problems found.</span> : <span className="text-alert">✗ {checked.errors.length} problem{checked.errors.length === 1 ? '' : 's'} to fix. Nothing can be imported until every line is right.</span>}
          </p>
          {checked.flights.length > 0 && <FlightsTable flights={checked.flights} partial={checked.errors.length > 0} />}
        </div>
      )}
      {problems.length > 0 && !runImport.isSuccess && <ProblemsTable problems={problems} />}

      {ready && !runImport.isSuccess && (
        <div className="space-y-2">
          {cancels > 0 && (
            <div role="note" className="space-y-2 rounded-md border-l-4 border-watch bg-watch-soft px-3 py-2 text-sm">
              <p>
                <strong>Caution:</strong> {cancels} stored passenger{cancels === 1 ? ' is' : 's are'} not in this file and will be marked cancelled (listed above under
                “Removed”). A checked-in passenger removed by mistake loses their place in the odds and in any denial ranking.
              </p>
              <p className="flex items-center gap-2">
                <input id={confirmId} type="checkbox" className="h-5 w-5" checked={confirmed} onChange={(e) => setConfirmed(e.target.checked)} />
                <label htmlFor={confirmId} className="font-bold">I have checked the {cancels} passenger{cancels === 1 ? '' : 's'} this import cancels</label>
              </p>
            </div>
          )}
          <Button disabled={runImport.isPending || (cancels > 0 && !confirmed)} onClick={() => file && runImport.mutate({ file, confirmRemovals: cancels > 0 && confirmed })}>
            {runImport.isPending ? 'Importing…' : `Import ${passengers} passenger${passengers === 1 ? '' : 's'}`}
          </Button>
        </div>
      )}
      {runImport.isPending && (
        <div className="space-y-1">
          <IndeterminateBar label="Importing the manifest" />
          <p className="text-sm text-ink-soft">Importing in one go: if anything fails, nothing is stored.</p>
        </div>
      )}
      {runImport.error && <p role="alert" className="font-bold text-alert">{runImport.error.message}</p>}
      {runImport.data && <ImportResult result={runImport.data} />}
    </div>
  );
}
