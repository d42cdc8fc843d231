import { useState } from 'react';
import type { StationLearning } from '@shared/schemas/learning';
import { Button } from '../../../components/ui/button';
import { useRequestTraining, useSaveRatesChoice } from '../api/learning';

type Pick = 'hand-set' | 'latest' | `v${number}`;

function pickOf(s: StationLearning): Pick {
  if (s.choice.mode === 'hand-set') return 'hand-set';
  return s.choice.pinnedVersion === null ? 'latest' : `v${s.choice.pinnedVersion}`;
}

/** The latest run and its progress, the retrain button, and which rates the station's forecasts use. */
export function TrainingPanel({ learning, canChange }: { learning: StationLearning; canChange: boolean }) {
  const train = useRequestTraining();
  const save = useSaveRatesChoice(learning.stationId);
  const [pick, setPick] = useState<Pick>(pickOf(learning));
  const job = learning.job;
  const busy = job !== null && (job.status === 'queued' || job.status === 'running');
  return (
    <div className="space-y-4">
      <p>
        {learning.latest
          ? <>Latest version <strong>{learning.latest.version}</strong>: learned from {learning.latest.flightsTrained} closed flights, scored on {learning.latest.flightsHeldOut} later ones held out.</>
          : 'No rates have been learned yet.'}{' '}
        Forecasts at this station use <strong>{learning.inUse === null ? 'the hand-set profile' : `learned version ${learning.inUse}`}</strong>.
        {learning.shockRho !== null && <> Learned day-to-day correlation of show-ups (rho): {learning.shockRho.toFixed(4)}.</>}
      </p>
      {job && (
        <div>
          <p id="training-progress-label">
            Training run {job.id} ({job.trigger}): {job.status}, {job.stage}{job.requests > 1 ? ` (asked for ${job.requests} times, run once)` : ''}
            {job.error && <span className="text-alert"> — {job.error}</span>}
          </p>
          <div role="progressbar" aria-labelledby="training-progress-label" aria-valuemin={0} aria-valuemax={100} aria-valuenow={job.progress} className="mt-1 h-3 w-full max-w-md rounded bg-line">
            <div className="h-3 rounded bg-harbour" style={{ width: `${job.progress}%` }} />
          </div>
        </div>
      )}
      {canChange && (
        <div className="flex flex-wrap items-end gap-4">
          <Button onClick={() => train.mutate()} disabled={busy || train.isPending}>{busy ? 'Training…' : 'Retrain now'}</Button>
          <label className="flex flex-col gap-1 font-bold">
            Rates for this station
            <select className="min-h-11 rounded-md border-2 border-line bg-card px-2" value={pick} onChange={(e) => setPick(e.target.value as Pick)}>
              <option value="hand-set">Hand-set profile</option>
              <option value="latest" disabled={!learning.latest}>Learned, always the latest version</option>
              {learning.versions.map((v) => <option key={v} value={`v${v}`}>Learned, stay on version {v}</option>)}
            </select>
          </label>
          <Button
            variant="secondary"
            disabled={save.isPending}
            onClick={() => save.mutate(pick === 'hand-set' ? { mode: 'hand-set', pinnedVersion: null } : { mode: 'learned', pinnedVersion: pick === 'latest' ? null : Number(pick.slice(1)) })}
          >
            Use these rates
          </Button>
        </div>
      )}
      {train.error && <p role="alert" className="text-alert">{train.error.message}</p>}
      {save.error && <p role="alert" className="text-alert">{save.error.message}</p>}
      {save.isSuccess && <p role="status">Saved. The station’s open flights are being recomputed.</p>}
    </div>
  );
}
