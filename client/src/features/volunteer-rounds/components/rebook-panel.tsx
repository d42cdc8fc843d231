import { useId, useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { Volunteer } from '@shared/schemas/volunteers';
import { Button } from '../../../components/ui/button';
import { localToInstant } from '@shared/time';
import { AirportTimeField } from '../../../components/ui/airport-time-field';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { formatTime, formatTimeWithZone } from '../../../lib/format';
import { alternatesQueryOptions, useRebook } from '../api/rounds';
import { delayWords } from '../model/round-words';
import { Problem } from './problem';
import type { FieldProblem } from '../../../components/ui/form-problems';

/** The airport a rebooking arrives at and its zone. */
export interface ArrivalClock {
  airport: string;
  timeZone: string;
}

/** Reads a typed wall-clock time on an airport's clock; the message names the field when it cannot. */
function readLocal(field: 'departure' | 'arrival', local: string, timeZone: string): { iso: string | null; error?: string } {
  if (!local) return { iso: null, error: `${field} must be a date and time` };
  try {
    return { iso: localToInstant(field, local, timeZone) };
  } catch (err) {
    return { iso: null, error: err instanceof Error ? err.message : `${field} must be a date and time` };
  }
}

/** Holds seats for an accepted volunteer on one of the carrier's later flights, or on a flight entered by hand. */
export function RebookPanel({ volunteer, flightId, timeZone, arrival, onDone }: { volunteer: Volunteer; flightId: number; timeZone: string; arrival?: ArrivalClock; onDone: () => void }) {
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
      {alternates.error && <Problem error={alternates.error} takeFocus={false} />}
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
                    Leaves {formatTime(a.departure, timeZone)} · arrives {arrival ? formatTimeWithZone(a.arrival, arrival.timeZone) : formatTime(a.arrival, timeZone)} ·{' '}
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
        <ManualRebooking volunteerId={volunteer.id} flightId={flightId} timeZone={timeZone} arrival={arrival} onDone={onDone} />
      ) : (
        <Button variant="secondary" className="mt-3" onClick={() => setManual(true)}>Another flight, entered by hand</Button>
      )}
      <Problem error={rebook.error} />
    </div>
  );
}

const MANUAL_LABELS: Record<string, string> = { carrier: 'Carrier', number: 'Flight number', departure: 'Departure', arrival: 'Arrival', 'manual.carrier': 'Carrier', 'manual.number': 'Flight number', 'manual.departure': 'Departure', 'manual.arrival': 'Arrival' };

type ManualErrors = Partial<Record<'carrier' | 'number' | 'departure' | 'arrival' | 'form', string>>;

function ManualRebooking({ volunteerId, flightId, timeZone, arrival: arrivalClock, onDone }: { volunteerId: number; flightId: number; timeZone: string; arrival?: ArrivalClock; onDone: () => void }) {
  // Departure is on this station's clock; arrival on the destination's (the station's only when it is unknown).
  const arrivesAt = arrivalClock ?? { airport: 'the destination', timeZone };
  const rebook = useRebook(flightId);
  const [f, setF] = useState({ carrier: '', number: '', departure: '', arrival: '' });
  const [errors, setErrors] = useState<ManualErrors>({});
  const [refused, setRefused] = useState<FieldProblem[] | null>(null);
  const id = useId();
  const ids = { carrier: `${id}-carrier`, number: `${id}-number`, departure: `${id}-departure`, arrival: `${id}-arrival` };
  const set = (k: keyof typeof f) => (v: string) => setF({ ...f, [k]: v });

  function submit(e: FormEvent) {
    e.preventDefault();
    const next: ManualErrors = {};
    const carrier = f.carrier.trim().toUpperCase();
    const number = f.number.trim().toUpperCase();
    if (!/^[A-Z0-9]{2,3}$/.test(carrier)) next.carrier = 'carrier must be a 2-3 character airline designator';
    if (!/^\d{1,4}[A-Z]?$/.test(number)) next.number = 'number must be 1-4 digits';
    const dep = readLocal('departure', f.departure, timeZone);
    const arr = readLocal('arrival', f.arrival, arrivesAt.timeZone);
    const departure = dep.iso;
    const arrival = arr.iso;
    if (dep.error) next.departure = dep.error;
    if (arr.error) next.arrival = arr.error;
    else if (departure && arrival && arrival <= departure) next.arrival = 'arrival must be after the departure';
    setErrors(next);
    const problems = Object.entries(next).map(([field, rule]) => ({ field, rule: rule.replace(new RegExp(`^${field} `), '') }));
    setRefused(problems.length ? problems : null);
    if (problems.length || !departure || !arrival) return;
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
      <p className="font-bold">Another flight · each time on the clock of the airport where it happens</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField id={ids.carrier} label="Carrier" value={f.carrier} onChange={set('carrier')} error={errors.carrier} maxLength={3} autoComplete="off" />
        <TextField id={ids.number} label="Flight number" value={f.number} onChange={set('number')} error={errors.number} maxLength={5} autoComplete="off" />
        <AirportTimeField id={ids.departure} label="Departure" airport="this station" timeZone={timeZone} value={f.departure} onChange={set('departure')} error={errors.departure} />
        <AirportTimeField id={ids.arrival} label="Arrival" airport={arrivesAt.airport} timeZone={arrivesAt.timeZone} value={f.arrival} onChange={set('arrival')} error={errors.arrival} />
      </div>
      <Button type="submit" disabled={rebook.isPending}>Hold the seat on this flight</Button>
      <Problem error={rebook.error} problems={refused} labels={MANUAL_LABELS} fieldIds={{ ...ids, 'manual.carrier': ids.carrier, 'manual.number': ids.number, 'manual.departure': ids.departure, 'manual.arrival': ids.arrival }} />
    </form>
  );
}
