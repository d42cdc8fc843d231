import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { BOOKING_OUTCOMES, type BookingOutcomeValue, type OutcomeRow } from '@shared/schemas/learning';
import { Button } from '../../../components/ui/button';
import { closedFlightsQueryOptions, outcomesQueryOptions, useCorrectOutcome } from '../api/learning';
import { CHANNEL_LABELS, type OutcomeChannel } from '@shared/schemas/booking-channel';

const yesNo = (b: boolean) => (b ? 'yes' : 'no');

function CorrectRow({ row, closedFlightId, stationId }: { row: OutcomeRow; closedFlightId: number; stationId: number }) {
  const [outcome, setOutcome] = useState<BookingOutcomeValue>(row.outcome);
  const [reason, setReason] = useState('');
  const correct = useCorrectOutcome(closedFlightId, stationId);
  return (
    <tr className="border-b border-line align-top">
      <th scope="row" className="py-1 pr-2 text-left font-normal">{row.pnr}</th>
      <td className="py-1 pr-2">{row.cabin} · {row.fareClass}{row.connecting ? ' · connecting' : ''} · {CHANNEL_LABELS[row.channel as OutcomeChannel] ?? row.channel}</td>
      <td className="py-1 pr-2">{yesNo(row.checkedInT24)} / {yesNo(row.checkedInT3)} / {yesNo(row.checkedInT1)}</td>
      <td className="py-1 pr-2">
        <select aria-label={`Outcome of ${row.pnr}`} className="rounded border-2 border-line bg-card px-1" value={outcome} onChange={(e) => setOutcome(e.target.value as BookingOutcomeValue)}>
          {BOOKING_OUTCOMES.map((o) => <option key={o} value={o}>{o}</option>)}
        </select>
        {row.corrected && <span className="ml-1 text-sm text-ink-soft">(corrected)</span>}
      </td>
      <td className="py-1">
        {outcome !== row.outcome && (
          <form className="flex gap-1" onSubmit={(e) => { e.preventDefault(); correct.mutate({ id: row.id, outcome, reason }); }}>
            <input aria-label={`Reason for correcting ${row.pnr}`} className="rounded border-2 border-line px-1" value={reason} onChange={(e) => setReason(e.target.value)} placeholder="why" />
            <Button type="submit" variant="secondary" className="min-h-8 px-2 py-0">Save</Button>
          </form>
        )}
        {correct.error && <p role="alert" className="text-alert">{correct.error.message}</p>}
      </td>
    </tr>
  );
}

/** The latest closed flights and, for the one opened, each booking's outcome, which a supervisor can correct. */
export function OutcomesPanel({ stationId }: { stationId: number }) {
  const flights = useQuery(closedFlightsQueryOptions(stationId));
  const [open, setOpen] = useState<number | null>(null);
  const outcomes = useQuery({ ...outcomesQueryOptions(open ?? 0), enabled: open !== null });
  if (flights.isPending) return <p className="text-ink-soft">Loading closed flights…</p>;
  if (flights.error) return <p role="alert" className="text-alert">{flights.error.message}</p>;
  return (
    <div className="space-y-3">
      <table className="w-full text-left text-sm">
        <caption className="mb-1 text-left font-bold">Latest closed flights</caption>
        <thead>
          <tr className="border-b-2 border-line">
            <th scope="col" className="py-1 pr-2">Flight</th><th scope="col" className="py-1 pr-2">Date</th><th scope="col" className="py-1 pr-2">Route</th>
            <th scope="col" className="py-1 pr-2">Booked</th><th scope="col" className="py-1 pr-2">Showed</th><th scope="col" className="py-1 pr-2">No-show</th>
            <th scope="col" className="py-1 pr-2">Volunteered / denied / missed connection</th><th scope="col" className="py-1"><span className="sr-only">Open</span></th>
          </tr>
        </thead>
        <tbody>
          {flights.data.flights.slice(0, 10).map((f) => (
            <tr key={f.id} className="border-b border-line">
              <th scope="row" className="py-1 pr-2 text-left font-normal">{f.flight}{f.demo ? ' (demo)' : ''}</th>
              <td className="py-1 pr-2">{f.serviceDate}</td><td className="py-1 pr-2">{f.route}</td><td className="py-1 pr-2">{f.booked}</td>
              <td className="py-1 pr-2">{f.outcomes.showed}</td><td className="py-1 pr-2">{f.outcomes['no-show']}</td>
              <td className="py-1 pr-2">{f.outcomes.volunteered} / {f.outcomes.denied} / {f.outcomes['missed-connection']}</td>
              <td className="py-1"><Button variant="quiet" className="min-h-8 px-2 py-0" onClick={() => setOpen(f.id)}>Outcomes of {f.flight} {f.serviceDate}</Button></td>
            </tr>
          ))}
        </tbody>
      </table>
      {open !== null && outcomes.data && (
        <div className="max-h-96 overflow-auto">
          <table className="w-full text-left text-sm">
            <caption className="mb-1 text-left font-bold">Outcomes (checked in at 24 h / 3 h / 1 h before departure)</caption>
            <thead>
              <tr className="border-b-2 border-line">
                <th scope="col" className="py-1 pr-2">PNR</th><th scope="col" className="py-1 pr-2">Cabin · fare · channel</th>
                <th scope="col" className="py-1 pr-2">Checked in 24 h / 3 h / 1 h</th><th scope="col" className="py-1 pr-2">Outcome</th><th scope="col" className="py-1">Correction</th>
              </tr>
            </thead>
            <tbody>
              {outcomes.data.outcomes.map((r) => <CorrectRow key={r.id} row={r} closedFlightId={open} stationId={stationId} />)}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
