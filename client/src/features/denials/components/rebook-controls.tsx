import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { Denial, RebookDenialBody } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { formatTime } from '../../../lib/format';
import { alternatesQueryOptions, useRebookDenial } from '../api/denials';
import { minutesWords } from '../model/words';

/**
 * Holds a seat on one of our later flights, on another carrier's flight, or records that no alternate was offered.
 * The compensation is fixed from the planned arrival this sets, and the statements go out.
 */
export function RebookControls({ denial, flightId, timeZone }: { denial: Denial; flightId: number; timeZone: string }) {
  const alternates = useQuery(alternatesQueryOptions(flightId));
  const rebook = useRebookDenial(flightId);
  const [error, setError] = useState<string | null>(null);
  const [manual, setManual] = useState({ carrier: '', number: '', departure: '', arrival: '' });
  const seats = denial.passengerIds.length;

  async function send(body: RebookDenialBody) {
    setError(null);
    try {
      await rebook.mutateAsync({ denialId: denial.id, ...body });
    } catch (err) {
      setError(err instanceof Error ? err.message : 'Not rebooked.');
    }
  }

  const toIso = (local: string) => (local ? new Date(local).toISOString() : '');
  return (
    <div className="mt-3 rounded-md border-2 border-dashed border-line p-3 no-print" aria-label={`Rebook ${denial.pnr}`}>
      <p className="font-bold">Rebook {denial.pnr} ({seats} seat{seats === 1 ? '' : 's'})</p>
      {alternates.data && alternates.data.alternates.length === 0 && <p className="text-sm text-ink-soft">No later flight of ours on this route.</p>}
      <div className="mt-2 flex flex-wrap gap-2">
        {alternates.data?.alternates.map((a) => (
          <Button key={a.id} variant="secondary" disabled={rebook.isPending || a.freeSeats < seats} onClick={() => send({ alternateFlightId: a.id })}>
            Rebook on {a.label} · {formatTime(a.departure, timeZone)} · {minutesWords(a.plannedArrivalDelayMinutes)} · {Math.max(0, a.freeSeats)} free
          </Button>
        ))}
        <Button variant="quiet" disabled={rebook.isPending} onClick={() => send({ noAlternate: true })}>
          No alternate offered
        </Button>
      </div>
      <details className="mt-2">
        <summary className="cursor-pointer text-harbour">Another carrier’s flight</summary>
        <div className="mt-2 grid gap-2 sm:grid-cols-4">
          <TextField label="Carrier" value={manual.carrier} onChange={(v) => setManual({ ...manual, carrier: v.toUpperCase() })} />
          <TextField label="Number" value={manual.number} onChange={(v) => setManual({ ...manual, number: v })} />
          <TextField label="Departs" type="datetime-local" value={manual.departure} onChange={(v) => setManual({ ...manual, departure: v })} />
          <TextField label="Arrives" type="datetime-local" value={manual.arrival} onChange={(v) => setManual({ ...manual, arrival: v })} />
        </div>
        <Button
          className="mt-2"
          variant="secondary"
          disabled={rebook.isPending}
          onClick={() => send({ manual: { ...manual, departure: toIso(manual.departure), arrival: toIso(manual.arrival) } })}
        >
          Rebook on this flight
        </Button>
        <p className="mt-1 text-sm text-ink-soft">Times as this browser’s clock reads them.</p>
      </details>
      {error && <p role="alert" className="mt-2 font-bold text-alert">{error}</p>}
    </div>
  );
}
