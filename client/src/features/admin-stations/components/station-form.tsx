import { useId, useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { REGIME_LABELS, REGIMES, type RegimeCode } from '@shared/schemas/common';
import type { StationSettings } from '@shared/schemas/admin-stations';
import { Button } from '../../../components/ui/button';
import { useFocusOnOpen } from '../../../components/ui/use-focus-on-open';
import { TextField } from '../../../components/ui/text-field';
import { airportQueryOptions, useCreateStation, useUpdateStation } from '../api/stations';
import { fieldError, FormProblems } from '../../../components/ui/form-problems';

const LABELS: Record<string, string> = {
  iata: 'Airport code', name: 'Name', regime: 'Passenger-rights rules', currency: 'Currency', riskTolerancePercent: 'Risk tolerance',
  departureGraceMinutes: 'Departure grace', maxOverbookingPercent: 'Booking limit', body: 'Form',
};

const num = (s: string) => (s.trim() === '' ? undefined : Number(s.replace(',', '.')));

export function StationForm({ station, onDone }: { station: StationSettings | null; onDone: (message: string) => void }) {
  const create = useCreateStation();
  const update = useUpdateStation();
  const regimeId = useId();
  const [v, setV] = useState({
    iata: station?.iata ?? '', name: station?.name ?? '', regime: (station?.regime ?? '') as RegimeCode | '', currency: station?.currency ?? '',
    risk: String(station?.riskTolerancePercent ?? 5), grace: String(station?.departureGraceMinutes ?? 10), overbooking: String(station?.maxOverbookingPercent ?? 150),
  });
  const set = (k: keyof typeof v) => (value: string) => setV((old) => ({ ...old, [k]: value }));
  const iata = v.iata.trim().toUpperCase();
  const airport = useQuery({ ...airportQueryOptions(iata), enabled: !station && /^[A-Z]{3}$/.test(iata) });
  const error = create.error ?? update.error;
  const pending = create.isPending || update.isPending;

  function submit(e: FormEvent) {
    e.preventDefault();
    const limits = { riskTolerancePercent: num(v.risk), departureGraceMinutes: num(v.grace), maxOverbookingPercent: num(v.overbooking) };
    const regime = v.regime || undefined;
    if (station) update.mutate({ id: station.id, body: { name: v.name, regime, currency: v.currency, ...limits } }, { onSuccess: (s) => onDone(`Saved ${s.iata}: ${REGIME_LABELS[s.regime]}, ${s.currency}, risk tolerance ${s.riskTolerancePercent} %.`) });
    // The regime is required: an empty choice goes to the server, which names the field.
    else create.mutate({ iata, name: v.name || undefined, regime: regime as RegimeCode, currency: v.currency, ...limits }, { onSuccess: (s) => onDone(`Opened ${s.iata} · ${s.name}, on ${s.timeZone} time. You now hold it: choose it at the top of the page to set it up.`) });
  }

  const regimeError = fieldError(error, 'regime');
  const heading = useFocusOnOpen();
  return (
    <form onSubmit={submit} noValidate aria-labelledby="station-form-title" className="space-y-3 rounded-lg border-2 border-harbour bg-card p-4">
      <h3 ref={heading} tabIndex={-1} id="station-form-title" className="text-xl font-bold">{station ? `Edit ${station.iata} · ${station.name}` : 'Open a station'}</h3>
      <FormProblems error={error} labels={LABELS} />
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {!station && (
          <TextField label="Airport code" value={v.iata} onChange={set('iata')} maxLength={3} error={fieldError(error, 'iata')}
            hint={airport.data ? `${airport.data.name}, ${airport.data.city}, ${airport.data.country} · zone ${airport.data.timeZone ?? 'unknown'}` : airport.isError ? `${iata} is not in the reference airport data` : 'IATA code; the time zone comes from the airport data'} />
        )}
        <TextField label="Name" value={v.name} onChange={set('name')} error={fieldError(error, 'name')} hint={station ? undefined : 'Optional: the airport’s name by default'} />
        <div>
          <label htmlFor={regimeId} className="mb-1 block font-bold">Passenger-rights rules</label>
          <select id={regimeId} value={v.regime} onChange={(e) => set('regime')(e.target.value)} aria-invalid={regimeError ? true : undefined} aria-describedby={regimeError ? `${regimeId}-error` : undefined}
            className={`min-h-11 w-full rounded-md border-2 bg-card px-3 py-2 text-lg ${regimeError ? 'border-alert' : 'border-line'}`}>
            <option value="">Choose…</option>
            {REGIMES.map((r) => <option key={r} value={r}>{REGIME_LABELS[r]}</option>)}
          </select>
          {regimeError && <p id={`${regimeId}-error`} className="mt-1 font-bold text-alert">{regimeError}</p>}
        </div>
        <TextField label="Currency" value={v.currency} onChange={set('currency')} maxLength={3} error={fieldError(error, 'currency')} hint="ISO 4217 code, e.g. EUR" />
        <TextField label="Risk tolerance (%)" inputMode="decimal" value={v.risk} onChange={set('risk')} error={fieldError(error, 'riskTolerancePercent')} hint="Chance of still being oversold after volunteers, 0.1-50" />
        <TextField label="Departure grace (minutes)" inputMode="numeric" value={v.grace} onChange={set('grace')} error={fieldError(error, 'departureGraceMinutes')} hint="After the scheduled time a flight counts as gone, 0-180" />
        <TextField label="Booking limit (% of seats)" inputMode="numeric" value={v.overbooking} onChange={set('overbooking')} error={fieldError(error, 'maxOverbookingPercent')} hint="Most bookings allowed per flight, 100-300" />
      </div>
      <p role="note" className="rounded-md border-l-4 border-watch bg-watch-soft px-3 py-2 text-sm">
        <strong>Caution:</strong> the rules chosen here set what Bumpboard computes for denied boarding at this station. The applicable regulation, the contract of carriage and the carrier’s compliance staff decide.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>{pending ? 'Saving…' : station ? 'Save station' : 'Open station'}</Button>
        <Button type="button" variant="quiet" onClick={() => onDone('')}>Close without saving</Button>
      </div>
    </form>
  );
}
