import type { ReactNode } from 'react';
import type { FlightDesk } from '@shared/schemas/flight-desk';
import { formatTime, zoneLabel } from '../../../lib/format';
import { useNow } from '../../../lib/use-now';
import { useArrival } from '../../../components/ui/use-arrival';
import { describeCountdown } from '../model/time';
import { FLIGHT_STATE_WORDS } from '../model/words';

/** The strip an agent reads first: which flight, where to, when it leaves and from which gate. */
export function DeskHeader({ desk, live }: { desk: FlightDesk; live: ReactNode }) {
  const { flight, station } = desk;
  const now = useNow(15_000);
  const tz = station.timeZone;
  const countdown = describeCountdown(flight.scheduledDeparture, now);
  const gone = new Date(flight.scheduledDeparture).getTime() < now;
  const heading = useArrival(`Flight desk · ${flight.carrierCode} ${flight.flightNumber} to ${flight.destination}`);
  return (
    <header className="rounded-lg border-2 border-harbour bg-card">
      <div className="flex flex-wrap items-stretch gap-x-8 gap-y-3 px-5 py-4">
        <div>
          <h1 ref={heading} tabIndex={-1} className="text-4xl font-bold text-harbour">
            {flight.carrierCode} {flight.flightNumber}
          </h1>
          <p className="text-xl font-bold">
            {flight.origin} <span aria-hidden>→</span>
            <span className="sr-only">to</span> {flight.destination}
          </p>
          <p className="text-ink-soft">
            {flight.serviceDate}
            {flight.aircraftType && ` · aircraft ${flight.aircraftType}`}
          </p>
        </div>
        <Fact label="Departs">
          <span className="text-4xl tabular-nums">{formatTime(flight.scheduledDeparture, tz)}</span>
          <span className={`block text-lg ${gone ? 'text-ink-soft' : 'text-ink'}`}>{countdown}</span>
        </Fact>
        <Fact label="Gate">
          <span className="text-4xl">{flight.gate ?? '—'}</span>
        </Fact>
        <Fact label="State">
          <span className="mt-1 inline-block rounded-md bg-harbour px-3 py-1 text-2xl text-white">{FLIGHT_STATE_WORDS[flight.state]}</span>
        </Fact>
        <div className="ml-auto flex flex-col items-end justify-between gap-2">
          {live}
          <p className="text-sm text-ink-soft">
            Times in {zoneLabel(tz)} · {station.iata}
          </p>
        </div>
      </div>
    </header>
  );
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <p className="text-sm font-bold tracking-wide text-ink-soft uppercase">{label}</p>
      <div className="font-bold">{children}</div>
    </div>
  );
}
