import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { WEEKDAY_NAMES, type Schedule } from '@shared/schemas/admin-flights';
import { localDate } from '@shared/time';
import { Button } from '../../../components/ui/button';
import { schedulesQueryOptions, useCancelSchedule } from '../api/schedules';
import { ResultMessage, seatsText } from '../../../components/ui/form-problems';
import { outcomeText, ScheduleForm } from './schedule-form';

export function SchedulesAdmin({ station }: { station: { id: number; iata: string; timeZone: string } }) {
  const list = useQuery(schedulesQueryOptions(station.id));
  const cancel = useCancelSchedule();
  const [editing, setEditing] = useState<Schedule | 'new' | null>(null);
  const [confirming, setConfirming] = useState<Schedule | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const today = localDate(new Date(), station.timeZone);
  const done = (text: string) => {
    setEditing(null);
    if (text) setMessage(text);
  };

  return (
    <div className="space-y-4">
      <ResultMessage text={message} />
      {cancel.error && <p role="alert" className="font-bold text-alert">Not cancelled: {cancel.error.message}</p>}
      {!editing && <Button onClick={() => { setMessage(null); setEditing('new'); }}>New weekly schedule</Button>}
      {editing && <ScheduleForm key={editing === 'new' ? 'new' : editing.id} station={station} schedule={editing === 'new' ? null : editing} today={today} onDone={done} />}
      {list.isPending && <p className="text-ink-soft">Loading schedules…</p>}
      {list.error && <p role="alert" className="font-bold text-alert">{list.error.message}</p>}
      {list.data && (
        <table className="w-full">
          <caption className="mb-2 text-left text-ink-soft">Weekly schedules from {station.iata}; times in {station.iata} local time ({station.timeZone}).</caption>
          <thead className="bg-harbour-soft text-left">
            <tr>
              <th className="px-2 py-2">Flight</th><th className="px-2 py-2">Days</th><th className="px-2 py-2">Departs</th><th className="px-2 py-2">Dates</th>
              <th className="px-2 py-2">Seats</th><th className="px-2 py-2">Flights</th><th className="px-2 py-2"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {list.data.schedules.map((s) => (
              <tr key={s.id} className="border-t border-line">
                <td className="px-2 py-2 font-bold">{s.carrierCode}{s.flightNumber} <span className="font-normal">{s.origin}–{s.destination}</span></td>
                <td className="px-2 py-2">{s.weekdays.map((d) => WEEKDAY_NAMES[d - 1]).join(' ')}</td>
                <td className="px-2 py-2">{s.departureTime} <span className="block text-sm text-ink-soft">{s.blockMinutes} min block</span></td>
                <td className="px-2 py-2">{s.validFrom} to {s.validTo}</td>
                <td className="px-2 py-2">{seatsText(s.seatsByCabin)}</td>
                <td className="px-2 py-2">{s.cancelled ? <strong className="text-alert">Cancelled</strong> : s.flights}</td>
                <td className="px-2 py-2 text-right whitespace-nowrap">
                  {!s.cancelled && confirming?.id !== s.id && (
                    <>
                      <Button variant="quiet" aria-label={`Edit schedule ${s.carrierCode}${s.flightNumber}`} onClick={() => { setMessage(null); setEditing(s); }}>Edit</Button>
                      <Button variant="secondary" aria-label={`Cancel schedule ${s.carrierCode}${s.flightNumber}`} onClick={() => setConfirming(s)}>Cancel…</Button>
                    </>
                  )}
                  {confirming?.id === s.id && (
                    <span className="inline-flex flex-wrap items-center justify-end gap-2">
                      <span className="text-sm">Cancels its unsold flights; sold ones stay.</span>
                      <Button variant="danger" autoFocus disabled={cancel.isPending} onClick={() => cancel.mutate(s.id, { onSuccess: (r) => { setConfirming(null); setMessage(outcomeText('Cancelled the schedule', r)); } })}>Cancel schedule</Button>
                      <Button variant="quiet" onClick={() => setConfirming(null)}>Keep it</Button>
                    </span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {list.data?.schedules.length === 0 && <p className="text-ink-soft">No weekly schedules yet.</p>}
    </div>
  );
}
