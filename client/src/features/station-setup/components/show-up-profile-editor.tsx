import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { DEFAULT_SHOW_UP_PROFILE } from '@shared/schemas/show-up-profile';
import { ApiRequestError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { showUpProfileQueryOptions, useSaveShowUpProfile, type StationShowUpProfile } from '../api/show-up-profile';
import { checkDraft, draftFromProfile, type DraftErrors, type ProfileDraft } from '../model/profile-draft';
import { formatStationDateTime } from '../model/format';
import type { StationRef } from '../model/station-ref';
import { BookingRatesTable } from './booking-rates-table';
import { CheckInCurveEditor } from './check-in-curve-editor';

type ScalarField = 'flexibleFareFactor' | 'checkedInShowRate' | 'checkInCloseMinutes' | 'minimumConnectMinutes';

const SCALARS: { field: ScalarField; label: string; hint: string; inputMode: 'decimal' | 'numeric' }[] = [
  { field: 'flexibleFareFactor', label: 'Flexible-fare factor', hint: 'Multiplies the booking rate for flexible fares, which no-show more often: 0.5 to 1.2.', inputMode: 'decimal' },
  { field: 'checkedInShowRate', label: 'Checked-in show rate', hint: 'Share of checked-in passengers who board: 0.995 or 99.5 %.', inputMode: 'decimal' },
  { field: 'checkInCloseMinutes', label: 'Check-in closes (minutes before departure)', hint: 'After this, a passenger not checked in is not expected.', inputMode: 'numeric' },
  { field: 'minimumConnectMinutes', label: 'Minimum connecting time (minutes)', hint: 'Connections tighter than this are at risk of missing the flight.', inputMode: 'numeric' },
];

function ProfileForm({ station, loaded }: { station: StationRef; loaded: StationShowUpProfile }) {
  const [draft, setDraft] = useState<ProfileDraft>(() => draftFromProfile(loaded.profile));
  const [tried, setTried] = useState(false);
  const [serverErrors, setServerErrors] = useState<DraftErrors>({});
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const save = useSaveShowUpProfile(station.id);

  // Once a save was tried, problems update as the admin types; the server's own answer stays until the next change.
  const live = tried ? checkDraft(draft) : null;
  const errors: DraftErrors = { ...(live && !live.ok ? live.errors : {}), ...serverErrors };
  const problemCount = Object.keys(errors).length;

  function change(next: ProfileDraft) {
    setDraft(next);
    setServerErrors({});
    setSavedAt(null);
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    setTried(true);
    const checked = checkDraft(draft);
    if (!checked.ok) return;
    try {
      const saved = await save.mutateAsync(checked.profile);
      setSavedAt(saved.updatedAt);
      setTried(false);
    } catch (err) {
      if (err instanceof ApiRequestError) setServerErrors(Object.fromEntries((err.body.details ?? [{ field: 'form', rule: err.message }]).map((d) => [d.field, d.rule])));
      else setServerErrors({ form: String(err) });
    }
  }

  const current = save.data ?? loaded;
  return (
    <form onSubmit={submit} noValidate aria-label={`Show-up profile of ${station.iata}`} className="space-y-6">
      <p className="text-ink-soft">
        How {station.iata} turns each booking into a chance of showing up. Saving recomputes the odds of the station’s flights of the next 24 hours.{' '}
        {current.isDefault ? <strong className="text-ink">The station uses the default figures until you save your own.</strong> : current.updatedAt && <>Last saved {formatStationDateTime(current.updatedAt, station.timeZone)}.</>}
      </p>
      <div className="grid items-start gap-6 lg:grid-cols-[auto_1fr]">
        <BookingRatesTable rates={draft.rates} errors={errors} onChange={(rates) => change({ ...draft, rates })} />
        <div className="grid gap-4 sm:grid-cols-2">
          {SCALARS.map((s) => (
            <TextField key={s.field} label={s.label} hint={s.hint} inputMode={s.inputMode} autoComplete="off" value={draft[s.field]} onChange={(v) => change({ ...draft, [s.field]: v })} error={errors[s.field]} />
          ))}
        </div>
      </div>
      <CheckInCurveEditor draft={draft} errors={errors} onChange={(curve) => change({ ...draft, curve })} />

      {errors.form && <p role="alert" className="font-bold text-alert">{errors.form}</p>}
      {problemCount > 0 && !errors.form && (
        <p role="alert" className="font-bold text-alert">
          {problemCount === 1 ? 'One value needs fixing' : `${problemCount} values need fixing`} before the profile can be saved. Nothing was saved.
        </p>
      )}
      {savedAt && (
        <p role="status" className="rounded-md border-l-4 border-calm bg-calm-soft px-3 py-2 font-bold">
          Saved {formatStationDateTime(savedAt, station.timeZone)}. The odds of the next 24 hours’ flights are being recomputed.
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save profile'}
        </Button>
        <Button type="button" variant="quiet" onClick={() => change(draftFromProfile(DEFAULT_SHOW_UP_PROFILE))}>
          Fill in the default figures
        </Button>
      </div>
    </form>
  );
}

export function ShowUpProfileEditor({ station }: { station: StationRef }) {
  const { data, isPending, error } = useQuery(showUpProfileQueryOptions(station.id));
  if (isPending) return <p className="text-ink-soft">Loading the profile…</p>;
  if (error) return <p role="alert" className="text-alert">{error.message}</p>;
  // Keyed by station: switching station starts a fresh form, while a refetch never overwrites what is being typed.
  return <ProfileForm key={station.id} station={station} loaded={data} />;
}
