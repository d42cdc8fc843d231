import { useState, type FormEvent } from 'react';
import { WEEKDAY_NAMES, WEEKDAYS, type Schedule, type ScheduleResult } from '@shared/schemas/admin-flights';
import { Button } from '../../../components/ui/button';
import { useFocusOnOpen } from '../../../components/ui/use-focus-on-open';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { useCreateSchedule, useUpdateSchedule } from '../api/schedules';
import { fieldError, FormProblems, parseSeats, seatsText } from '../../../components/ui/form-problems';

const LABELS: Record<string, string> = {
  carrierCode: 'Carrier', flightNumber: 'Flight number', destination: 'To', departureTime: 'Departs', blockMinutes: 'Block time', seatsByCabin: 'Seats per cabin',
  aircraftType: 'Aircraft type', weekdays: 'Days', validFrom: 'First day', validTo: 'Last day', body: 'Form',
};

/** In words, what saving did to the dated flights. */
export function outcomeText(verb: string, r: ScheduleResult): string {
  const s = r.schedule;
  const parts = [`${verb} ${s.carrierCode}${s.flightNumber} ${s.origin}–${s.destination}:`, `${r.created} flight${r.created === 1 ? '' : 's'} added`];
  if (r.updated) parts.push(`${r.updated} moved or resized`);
  if (r.cancelled) parts.push(`${r.cancelled} cancelled`);
  const text = `${parts[0]} ${parts.slice(1).join(', ')}.`;
  return r.skipped.length ? `${text} ${r.skipped.length} day${r.skipped.length === 1 ? '' : 's'} left alone: ${r.skipped.map((k) => `${k.date} (${k.reason})`).join('; ')}.` : text;
}

export function ScheduleForm({ station, schedule, today, onDone }: { station: { id: number; iata: string; timeZone: string }; schedule: Schedule | null; today: string; onDone: (message: string) => void }) {
  const create = useCreateSchedule(station.id);
  const update = useUpdateSchedule();
  const [local, setLocal] = useState<Error | null>(null);
  const [v, setV] = useState({
    carrierCode: schedule?.carrierCode ?? 'ZZ', flightNumber: schedule?.flightNumber ?? '', destination: schedule?.destination ?? '', departureTime: schedule?.departureTime ?? '',
    blockMinutes: String(schedule?.blockMinutes ?? ''), seats: schedule ? seatsText(schedule.seatsByCabin) : '', aircraftType: schedule?.aircraftType ?? '',
    validFrom: schedule?.validFrom ?? today, validTo: schedule?.validTo ?? '',
  });
  const [days, setDays] = useState<number[]>(schedule?.weekdays ?? []);
  const set = (k: keyof typeof v) => (value: string) => setV((old) => ({ ...old, [k]: value }));
  const error = local ?? create.error ?? update.error;
  const pending = create.isPending || update.isPending;

  function submit(e: FormEvent) {
    e.preventDefault();
    setLocal(null);
    const seatsByCabin = parseSeats(v.seats);
    if (!seatsByCabin) return setLocal(new ApiRequestError(400, { error: 'invalid_request', message: 'seatsByCabin', details: [{ field: 'seatsByCabin', rule: 'write each cabin as a letter and a number, e.g. J 12, Y 138' }] }));
    const body = { departureTime: v.departureTime, blockMinutes: Number(v.blockMinutes), seatsByCabin, aircraftType: v.aircraftType || null, weekdays: days, validFrom: v.validFrom, validTo: v.validTo };
    if (schedule) update.mutate({ id: schedule.id, body }, { onSuccess: (r) => onDone(outcomeText('Saved', r)) });
    else create.mutate({ ...body, carrierCode: v.carrierCode, flightNumber: v.flightNumber, destination: v.destination.toUpperCase() }, { onSuccess: (r) => onDone(outcomeText('Created', r)) });
  }

  const daysError = fieldError(error, 'weekdays');
  const heading = useFocusOnOpen();
  return (
    <form onSubmit={submit} noValidate aria-labelledby="schedule-form-title" className="space-y-3 rounded-lg border-2 border-harbour bg-card p-4">
      <h3 ref={heading} tabIndex={-1} id="schedule-form-title" className="text-xl font-bold">{schedule ? `Edit schedule ${schedule.carrierCode}${schedule.flightNumber}` : `New weekly schedule from ${station.iata}`}</h3>
      <p className="text-sm text-ink-soft">Saving makes the dated flights match: missing days are added, flights not yet open move to the new time, and days dropped are cancelled where nobody is booked.</p>
      <FormProblems error={error} labels={LABELS} />
      <div className="grid gap-3 sm:grid-cols-3 lg:grid-cols-5">
        {!schedule && (
          <>
            <TextField label="Carrier" value={v.carrierCode} onChange={set('carrierCode')} error={fieldError(error, 'carrierCode')} hint="2-3 letters or digits" />
            <TextField label="Flight number" value={v.flightNumber} onChange={set('flightNumber')} error={fieldError(error, 'flightNumber')} hint="1-4 digits" />
            <TextField label="To" value={v.destination} onChange={set('destination')} error={fieldError(error, 'destination')} hint="IATA airport code" maxLength={3} />
          </>
        )}
        <TextField label="Departs" type="time" value={v.departureTime} onChange={set('departureTime')} error={fieldError(error, 'departureTime')} hint={`${station.iata} local time, summer and winter`} />
        <TextField label="Block time (minutes)" inputMode="numeric" value={v.blockMinutes} onChange={set('blockMinutes')} error={fieldError(error, 'blockMinutes')} hint="Gate to gate, 20-1200" />
        <TextField label="Seats per cabin" value={v.seats} onChange={set('seats')} error={fieldError(error, 'seatsByCabin')} hint="e.g. J 12, Y 138" />
        <TextField label="Aircraft type" value={v.aircraftType} onChange={set('aircraftType')} error={fieldError(error, 'aircraftType')} hint="Optional" />
        <TextField label="First day" type="date" value={v.validFrom} onChange={set('validFrom')} error={fieldError(error, 'validFrom')} />
        <TextField label="Last day" type="date" value={v.validTo} onChange={set('validTo')} error={fieldError(error, 'validTo')} hint="Less than 190 days after the first" />
      </div>
      <fieldset aria-describedby={daysError ? 'days-error' : undefined}>
        <legend className="mb-1 font-bold">Days it flies</legend>
        <div className="flex flex-wrap gap-3">
          {WEEKDAYS.map((d) => (
            <label key={d} className="flex min-h-11 items-center gap-2 rounded-md border-2 border-line px-3">
              <input type="checkbox" className="h-5 w-5" checked={days.includes(d)} onChange={(e) => setDays((old) => (e.target.checked ? [...old, d].sort() : old.filter((x) => x !== d)))} />
              {WEEKDAY_NAMES[d - 1]}
            </label>
          ))}
        </div>
        {daysError && <p id="days-error" className="mt-1 font-bold text-alert">{daysError}</p>}
      </fieldset>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>{pending ? 'Saving…' : schedule ? 'Save and update its flights' : 'Create and add its flights'}</Button>
        <Button type="button" variant="quiet" onClick={() => onDone('')}>Close without saving</Button>
      </div>
    </form>
  );
}
