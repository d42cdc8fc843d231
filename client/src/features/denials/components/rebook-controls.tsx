import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { Denial, RebookDenialBody } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { localToInstant } from '@shared/time';
import { AirportTimeField } from '../../../components/ui/airport-time-field';
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
  const [finalArrival, setFinalArrival] = useState('');
  const seats = denial.passengerIds.length;
  // Each typed time is read on the clock of the airport where it happens, never the browser's.
  const journey = denial.journey;
  const arrivalAirport = journey?.legDestination ?? 'destination';
  const arrivalZone = journey?.legDestinationTimeZone ?? 'UTC';
  const measuredBeyond = journey !== null && journey.measuredTo !== journey.legDestination;

  async function send(body: RebookDenialBody) {
    setError(null);
    try {
      const extra = measuredBeyond && finalArrival ? { arrivalAtDestination: localToInstant('arrivalAtDestination', finalArrival, journey?.measuredToTimeZone ?? 'UTC') } : {};
      await rebook.mutateAsync({ denialId: denial.id, ...body, ...extra });
    } catch (err) {
      setError(err instanceof Error ? err.message : 'Not rebooked.');
    }
  }

  function sendManual() {
    try {
      send({ manual: { ...manual, departure: localToInstant('departure', manual.departure, timeZone), arrival: localToInstant('arrival', manual.arrival, arrivalZone) } });
    } catch (err) {
      setError(err instanceof Error ? err.message : 'Check the times.');
    }
  }
  return (
    <div className="mt-3 rounded-md border-2 border-dashed border-line p-3 no-print" aria-label={`Rebook ${denial.pnr}`}>
      <p className="font-bold">Rebook {denial.pnr} ({seats} seat{seats === 1 ? '' : 's'})</p>
      {journey && measuredBeyond && (
        <div className="mt-2 max-w-md">
          <p className="text-sm">
            Journey continues {journey.onward.join(', ')}; the delay counts at {journey.measuredTo}: {journey.measuredBecause}. If the rebooking misses the onward
            flight, give the planned arrival there.
          </p>
          <AirportTimeField label="Planned arrival" airport={journey.measuredTo} timeZone={journey.measuredToTimeZone ?? 'UTC'} value={finalArrival} onChange={setFinalArrival} />
        </div>
      )}
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
          <AirportTimeField label="Departs" airport="this station" timeZone={timeZone} value={manual.departure} onChange={(v) => setManual({ ...manual, departure: v })} />
          <AirportTimeField label="Arrives" airport={arrivalAirport} timeZone={arrivalZone} value={manual.arrival} onChange={(v) => setManual({ ...manual, arrival: v })} />
        </div>
        <Button
          className="mt-2"
          variant="secondary"
          disabled={rebook.isPending}
          onClick={sendManual}
        >
          Rebook on this flight
        </Button>
      </details>
      {error && <p role="alert" className="mt-2 font-bold text-alert">{error}</p>}
    </div>
  );
}
