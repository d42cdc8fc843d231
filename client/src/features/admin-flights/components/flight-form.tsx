import { useState, type FormEvent } from 'react';
import type { AdminFlight } from '@shared/schemas/admin-flights';
import { Button } from '../../../components/ui/button';
import { useFocusOnOpen } from '../../../components/ui/use-focus-on-open';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { useCreateFlight, useUpdateFlight } from '../api/flights';
import { fieldError, FormProblems, parseSeats, seatsText } from '../../../components/ui/form-problems';

export const FLIGHT_LABELS: Record<string, string> = {
  carrierCode: 'Carrier', flightNumber: 'Flight number', serviceDate: 'Date', departureTime: 'Departs', blockMinutes: 'Block time',
  destination: 'To', seatsByCabin: 'Seats per cabin', aircraftType: 'Aircraft type', gate: 'Gate', body: 'Form',
};

const seatsProblem = () => new ApiRequestError(400, { error: 'invalid_request', message: 'seatsByCabin', details: [{ field: 'seatsByCabin', rule: 'write each cabin as a letter and a number, e.g. J 12, Y 138' }] });

/** Adds a flight, or edits the times, seats, aircraft and gate of one (its number, day and route stay). */
export function FlightForm({ station, flight, defaultDate, onDone }: { station: { id: number; iata: string; timeZone: string }; flight: AdminFlight | null; defaultDate: string; onDone: (message: string) => void }) {
  const create = useCreateFlight(station.id);
  const update = useUpdateFlight();
  const [local, setLocal] = useState<Error | null>(null);
  const [v, setV] = useState({
    carrierCode: flight?.carrierCode ?? 'ZZ', flightNumber: flight?.flightNumber ?? '', serviceDate: flight?.serviceDate ?? defaultDate,
    departureTime: flight?.departureTime ?? '', blockMinutes: String(flight?.blockMinutes ?? ''), destination: flight?.destination ?? '',
    seats: flight ? seatsText(flight.seatsByCabin) : '', aircraftType: flight?.aircraftType ?? '', gate: flight?.gate ?? '',
  });
  const set = (k: keyof typeof v) => (value: string) => setV((old) => ({ ...old, [k]: value }));
  const error = local ?? create.error ?? update.error;
  const pending = create.isPending || update.isPending;

  function submit(e: FormEvent) {
    e.preventDefault();
    setLocal(null);
    const seatsByCabin = parseSeats(v.seats);
    if (!seatsByCabin) return setLocal(seatsProblem());
    const common = { departureTime: v.departureTime, blockMinutes: Number(v.blockMinutes), seatsByCabin, aircraftType: v.aircraftType || null, gate: v.gate || null };
    const label = `${v.carrierCode.toUpperCase()}${v.flightNumber.toUpperCase()} on ${v.serviceDate}`;
    if (flight) update.mutate({ id: flight.id, body: common }, { onSuccess: (f) => onDone(`Saved ${f.carrierCode}${f.flightNumber} on ${f.serviceDate}: departs ${f.departureTime} ${station.iata} time.`) });
    else create.mutate({ ...common, carrierCode: v.carrierCode, flightNumber: v.flightNumber, serviceDate: v.serviceDate, destination: v.destination.toUpperCase() }, { onSuccess: () => onDone(`Added ${label} from ${station.iata}. It shows on the departures board on its day.`) });
  }

  const heading = useFocusOnOpen();
  return (
    <form onSubmit={submit} noValidate aria-labelledby="flight-form-title" className="space-y-3 rounded-lg border-2 border-harbour bg-card p-4">
      <h3 ref={heading} tabIndex={-1} id="flight-form-title" className="text-xl font-bold">{flight ? `Edit ${flight.carrierCode}${flight.flightNumber} on ${flight.serviceDate}` : `Add a flight from ${station.iata}`}</h3>
      <FormProblems error={error} labels={FLIGHT_LABELS} />
      <div className="grid gap-3 sm:grid-cols-3 lg:grid-cols-5">
        {!flight && (
          <>
            <TextField label="Carrier" value={v.carrierCode} onChange={set('carrierCode')} error={fieldError(error, 'carrierCode')} hint="2-3 letters or digits" />
            <TextField label="Flight number" value={v.flightNumber} onChange={set('flightNumber')} error={fieldError(error, 'flightNumber')} hint="1-4 digits" />
            <TextField label="Date" type="date" value={v.serviceDate} onChange={set('serviceDate')} error={fieldError(error, 'serviceDate')} hint={`Local date at ${station.iata}`} />
            <TextField label="To" value={v.destination} onChange={set('destination')} error={fieldError(error, 'destination')} hint="IATA airport code" maxLength={3} />
          </>
        )}
        <TextField label="Departs" type="time" value={v.departureTime} onChange={set('departureTime')} error={fieldError(error, 'departureTime')} hint={`${station.iata} local time (${station.timeZone})`} />
        <TextField label="Block time (minutes)" inputMode="numeric" value={v.blockMinutes} onChange={set('blockMinutes')} error={fieldError(error, 'blockMinutes')} hint="Gate to gate, 20-1200" />
        <TextField label="Seats per cabin" value={v.seats} onChange={set('seats')} error={fieldError(error, 'seatsByCabin')} hint="e.g. J 12, Y 138" />
        <TextField label="Aircraft type" value={v.aircraftType} onChange={set('aircraftType')} error={fieldError(error, 'aircraftType')} hint="Optional, e.g. 321" />
        <TextField label="Gate" value={v.gate} onChange={set('gate')} error={fieldError(error, 'gate')} hint="Optional" />
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>{pending ? 'Saving…' : flight ? 'Save changes' : 'Add flight'}</Button>
        <Button type="button" variant="quiet" onClick={() => onDone('')}>Close without saving</Button>
      </div>
    </form>
  );
}
