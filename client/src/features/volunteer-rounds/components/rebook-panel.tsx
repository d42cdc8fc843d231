import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { Volunteer } from '@shared/schemas/volunteers';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { formatTime } from '../../../lib/format';
import { alternatesQueryOptions, useRebook } from '../api/rounds';
import { delayWords } from '../model/round-words';
import { zonedToIso } from '../model/zoned-time';
import { Problem } from './problem';

/** Holds seats for an accepted volunteer on one of the carrier's later flights, or on a flight entered by hand. */
export function RebookPanel({ volunteer, flightId, timeZone, onDone }: { volunteer: Volunteer; flightId: number; timeZone: string; onDone: () => void }) {
  const alternates = useQuery(alternatesQueryOptions(flightId));
  const rebook = useRebook(flightId);
  const [manual, setManual] = useState(false);
  const seats = volunteer.passengerIds.length;
  const hold = (alternateFlightId: number) => rebook.mutate({ volunteerId: volunteer.id, body: { alternateFlightId } }, { onSuccess: onDone });

  return (
    <div className="rounded-lg border-2 border-harbour bg-harbour-soft/40 p-3" data-testid="rebook-panel">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h4 className="text-lg font-bold">Rebook {volunteer.names.join(', ')} ({seats} {seats === 1 ? 'seat' : 'seats'})</h4>
        <Button variant="quiet" onClick={onDone}>Cancel</Button>
      </div>
      {alternates.isPending && <p className="text-ink-soft">Looking for later flights…</p>}
      {alternates.error && <Problem error={alternates.error} />}
      {alternates.data && alternates.data.alternates.length === 0 && <p className="text-lg">No later flight of ours on this route. Enter another flight by hand.</p>}
      {alternates.data && alternates.data.alternates.length > 0 && (
        <ul className="mt-2 space-y-2" aria-label="Later flights">
          {alternates.data.alternates.map((a) => {
            const fits = a.freeSeats >= seats;
            return (
              <li key={a.id} className="flex flex-wrap items-center justify-between gap-3 rounded-md border-2 border-line bg-card p-3">
                <div>
                  <p className="text-xl font-bold">{a.label}</p>
                  <p>
                    Leaves {formatTime(a.departure, timeZone)} · arrives {formatTime(a.arrival, timeZone)} ·{' '}
                    <strong>{a.plannedArrivalDelayMinutes > 0 ? `${delayWords(a.plannedArrivalDelayMinutes)} later` : 'on time'}</strong> than planned
                  </p>
                  <p className={fits ? 'text-calm' : 'font-bold text-alert'}>
                    {a.freeSeats > 0 ? `${a.freeSeats} free ${a.freeSeats === 1 ? 'seat' : 'seats'}` : 'Full'}
                    {!fits && a.freeSeats > 0 ? ` — not enough for ${seats}` : ''}
                  </p>
                </div>
                <Button disabled={!fits || rebook.isPending} onClick={() => hold(a.id)}>
                  Hold {seats === 1 ? 'a seat' : `${seats} seats`} on {a.label}
                </Button>
              </li>
            );
          })}
        </ul>
      )}
      {manual ? (
        <ManualRebooking volunteerId={volunteer.id} flightId={flightId} timeZone={timeZone} onDone={onDone} />
      ) : (
        <Button variant="secondary" className="mt-3" onClick={() => setManual(true)}>Another flight, entered by hand</Button>
      )}
      <Problem error={rebook.error} />
    </div>
  );
}

type ManualErrors = Partial<Record<'carrier' | 'number' | 'departure' | 'arrival' | 'form', string>>;

function ManualRebooking({ volunteerId, flightId, timeZone, onDone }: { volunteerId: number; flightId: number; timeZone: string; onDone: () => void }) {
  const rebook = useRebook(flightId);
  const [f, setF] = useState({ carrier: '', number: '', departure: '', arrival: '' });
  const [errors, setErrors] = useState<ManualErrors>({});
  const set = (k: keyof typeof f) => (v: string) => setF({ ...f, [k]: v });

  function submit(e: FormEvent) {
    e.preventDefault();
    const next: ManualErrors = {};
    const carrier = f.carrier.trim().toUpperCase();
    const number = f.number.trim().toUpperCase();
    if (!/^[A-Z0-9]{2,3}$/.test(carrier)) next.carrier = 'carrier must be a 2-3 character airline designator';
    if (!/^\d{1,4}[A-Z]?$/.test(number)) next.number = 'number must be 1-4 digits';
    const departure = zonedToIso(f.departure, timeZone);
    const arrival = zonedToIso(f.arrival, timeZone);
    if (!departure) next.departure = 'departure must be a date and time';
    if (!arrival) next.arrival = 'arrival must be a date and time';
    else if (departure && arrival <= departure) next.arrival = 'arrival must be after the departure';
    setErrors(next);
    if (Object.keys(next).length || !departure || !arrival) return;
    rebook.mutate(
      { volunteerId, body: { manual: { carrier, number, departure, arrival } } },
      {
        onSuccess: onDone,
        onError: (err) => {
          if (err instanceof ApiRequestError && err.body.details) setErrors(Object.fromEntries(err.body.details.map((d) => [d.field.replace(/^manual\./, ''), d.rule])));
        },
      },
    );
  }

  return (
    <form onSubmit={submit} noValidate className="mt-3 space-y-3 rounded-md border-2 border-line bg-card p-3" aria-label="Another flight, entered by hand">
      <p className="font-bold">Another flight · times at this station ({timeZone.replace(/_/g, ' ')})</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Carrier" value={f.carrier} onChange={set('carrier')} error={errors.carrier} maxLength={3} autoComplete="off" />
        <TextField label="Flight number" value={f.number} onChange={set('number')} error={errors.number} maxLength={5} autoComplete="off" />
        <TextField label="Departure" type="datetime-local" value={f.departure} onChange={set('departure')} error={errors.departure} />
        <TextField label="Arrival" type="datetime-local" value={f.arrival} onChange={set('arrival')} error={errors.arrival} />
      </div>
      <Button type="submit" disabled={rebook.isPending}>Hold the seat on this flight</Button>
      <Problem error={rebook.error} />
    </form>
  );
}
