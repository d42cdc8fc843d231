import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { AdminFlight } from '@shared/schemas/admin-flights';
import { localDate } from '@shared/time';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { adminFlightsQueryOptions, useCancelFlight } from '../api/flights';
import { FlightForm } from './flight-form';
import { fieldError, FormProblems, ResultMessage, seatsText } from '../../../components/ui/form-problems';

const addDays = (date: string, n: number) => new Date(Date.parse(`${date}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
const STATE_WORDS: Record<AdminFlight['state'], string> = { scheduled: 'Scheduled', 'check-in-open': 'Check-in open', boarding: 'Boarding', closed: 'Closed', departed: 'Departed', cancelled: 'Cancelled' };

export function FlightsAdmin({ station }: { station: { id: number; iata: string; timeZone: string } }) {
  const today = localDate(new Date(), station.timeZone);
  const [range, setRange] = useState({ from: today, to: addDays(today, 13) });
  const [editing, setEditing] = useState<AdminFlight | 'new' | null>(null);
  const [cancelling, setCancelling] = useState<AdminFlight | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const list = useQuery(adminFlightsQueryOptions(station.id, range.from, range.to));

  const done = (text: string) => {
    setEditing(null);
    setCancelling(null);
    if (text) setMessage(text);
  };

  return (
    <div className="space-y-4">
      <ResultMessage text={message} />
      <div className="flex flex-wrap items-end gap-3">
        <TextField label="From" type="date" value={range.from} onChange={(from) => setRange((r) => ({ ...r, from }))} error={fieldError(list.error, 'from')} />
        <TextField label="To" type="date" value={range.to} onChange={(to) => setRange((r) => ({ ...r, to }))} error={fieldError(list.error, 'to')} />
        {!editing && <Button onClick={() => { setMessage(null); setEditing('new'); }}>Add a flight</Button>}
      </div>
      {editing && <FlightForm key={editing === 'new' ? 'new' : editing.id} station={station} flight={editing === 'new' ? null : editing} defaultDate={range.from} onDone={done} />}
      {cancelling && <CancelFlight flight={cancelling} onDone={done} />}
      {list.isPending && <p className="text-ink-soft">Loading flights…</p>}
      {list.error && !fieldError(list.error, 'to') && !fieldError(list.error, 'from') && <p role="alert" className="font-bold text-alert">{list.error.message}</p>}
      {list.data && (
        <div className="overflow-x-auto">
          <table className="w-full">
            <caption className="mb-2 text-left text-ink-soft">
              {list.data.flights.length} flight{list.data.flights.length === 1 ? '' : 's'} from {station.iata}, {range.from} to {range.to} (at most 62 days at once); times in {station.iata} local time ({list.data.timeZone}).
            </caption>
            <thead className="bg-harbour-soft text-left">
              <tr>
                <th className="px-2 py-2">Flight</th><th className="px-2 py-2">Date</th><th className="px-2 py-2">Departs</th><th className="px-2 py-2">To</th>
                <th className="px-2 py-2">Seats</th><th className="px-2 py-2">Booked</th><th className="px-2 py-2">State</th><th className="px-2 py-2"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {list.data.flights.map((f) => {
                const closed = f.state === 'cancelled' || f.state === 'departed';
                return (
                  <tr key={f.id} className="border-t border-line">
                    <td className="px-2 py-2 font-bold">{f.carrierCode}{f.flightNumber}{f.scheduleId && <span className="block text-sm font-normal text-ink-soft">from a schedule</span>}</td>
                    <td className="px-2 py-2">{f.serviceDate}</td>
                    <td className="px-2 py-2">{f.departureTime}<span className="block text-sm text-ink-soft">{f.blockMinutes} min block</span></td>
                    <td className="px-2 py-2">{f.destination}</td>
                    <td className="px-2 py-2">{seatsText(f.seatsByCabin)}</td>
                    <td className="px-2 py-2">{f.bookings}</td>
                    <td className="px-2 py-2">{f.state === 'cancelled' ? <strong className="text-alert">Cancelled</strong> : STATE_WORDS[f.state]}</td>
                    <td className="px-2 py-2 text-right whitespace-nowrap">
                      {!closed && (
                        <>
                          <Button variant="quiet" aria-label={`Edit ${f.carrierCode}${f.flightNumber} on ${f.serviceDate}`} onClick={() => { setMessage(null); setCancelling(null); setEditing(f); }}>Edit</Button>
                          <Button variant="secondary" aria-label={`Cancel ${f.carrierCode}${f.flightNumber} on ${f.serviceDate}`} onClick={() => { setMessage(null); setEditing(null); setCancelling(f); }}>Cancel…</Button>
                        </>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {list.data.flights.length === 0 && <p className="py-3 text-ink-soft">No flights in these dates. Add one, or set up a weekly schedule on the Schedules screen.</p>}
        </div>
      )}
    </div>
  );
}

function CancelFlight({ flight, onDone }: { flight: AdminFlight; onDone: (message: string) => void }) {
  const cancel = useCancelFlight();
  const [reason, setReason] = useState('');
  const name = `${flight.carrierCode}${flight.flightNumber} on ${flight.serviceDate}`;
  function submit(e: FormEvent) {
    e.preventDefault();
    cancel.mutate({ id: flight.id, reason }, { onSuccess: (f) => onDone(`Cancelled ${name}. ${f.bookings ? `${f.bookings} booked passenger${f.bookings === 1 ? '' : 's'} still need rebooking and notices.` : 'Nobody was booked on it.'}`) });
  }
  return (
    <form onSubmit={submit} noValidate aria-labelledby="cancel-title" className="space-y-3 rounded-lg border-2 border-alert bg-card p-4">
      <h3 id="cancel-title" className="text-xl font-bold">Cancel {name}?</h3>
      <p role="note" className="rounded-md border-l-4 border-watch bg-watch-soft px-3 py-2 text-sm">
        <strong>Caution:</strong> {flight.bookings} passenger{flight.bookings === 1 ? ' is' : 's are'} booked. Cancelling does not rebook or notify them. A cancellation can give
        passengers rights to care, rerouting or compensation: the applicable regulation, the contract of carriage and the carrier’s compliance staff decide.
      </p>
      <FormProblems error={cancel.error} labels={{ reason: 'Reason' }} />
      <TextField label="Reason" value={reason} onChange={setReason} error={fieldError(cancel.error, 'reason')} hint="Kept in the audit log" autoFocus />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" disabled={cancel.isPending}>{cancel.isPending ? 'Cancelling…' : `Cancel ${flight.carrierCode}${flight.flightNumber}`}</Button>
        <Button type="button" variant="quiet" onClick={() => onDone('')}>Keep the flight</Button>
      </div>
    </form>
  );
}
