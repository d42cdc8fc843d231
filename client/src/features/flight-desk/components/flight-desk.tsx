import type { ReactNode } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { FlightDesk as FlightDeskData } from '@shared/schemas/flight-desk';
import { Link } from 'react-router-dom';
import { ComingNext } from '../../../components/ui/page';
import { useArrival } from '../../../components/ui/use-arrival';
import { ApiRequestError } from '../../../lib/api-client';
import { sessionQueryOptions } from '../../../lib/session';
import { useLiveSnapshot } from '../../../lib/socket';
import { formatClock } from '../model/time';
import { deskPassengersQueryOptions, flightDeskQueryOptions, flightEventsQueryOptions, forecastHistoryQueryOptions } from '../api/flight-desk';
import { useFlightLive } from '../api/use-flight-live';
import { CabinCounts } from './cabin-counts';
import { DeskGlance } from './desk-glance';
import { DeskHeader } from './desk-header';
import { EventTrail } from './event-trail';
import { LiveIndicator } from './live-indicator';
import { OddsPanel } from './odds-panel';
import { PassengerList } from './passenger-list';
import { ShockControl } from './shock-control';

/**
 * The gate agent's main screen for one flight, kept live by the flight's change notices. `volunteerRounds` draws the
 * rounds panel from the loaded desk, `deniedBoarding` the denied-boarding panel, `compensations` the money owed: the route composes them, so this
 * feature needs no other feature.
 */
export function FlightDesk({
  flightId,
  volunteerRounds,
  deniedBoarding,
  compensations,
  roundGlance,
}: {
  flightId: number;
  volunteerRounds?: (desk: FlightDeskData) => ReactNode;
  deniedBoarding?: (desk: FlightDeskData) => ReactNode;
  compensations?: (desk: FlightDeskData) => ReactNode;
  /** The current round in one line, for the glance strip. */
  roundGlance?: ReactNode;
}) {
  const desk = useQuery(flightDeskQueryOptions(flightId));
  const passengers = useQuery(deskPassengersQueryOptions(flightId));
  const history = useQuery(forecastHistoryQueryOptions(flightId));
  const events = useQuery(flightEventsQueryOptions(flightId));
  const { data: session } = useQuery(sessionQueryOptions());
  const joined = useFlightLive(flightId);
  const { state: liveState } = useLiveSnapshot();

  if (desk.isPending) return <p className="p-6 text-lg text-ink-soft">Loading the flight…</p>;
  if (desk.error) return <DeskError error={desk.error} />;

  const d = desk.data;
  const tz = d.station.timeZone;
  const role = session?.user?.role;
  const canSetShock = role === 'supervisor' || role === 'admin';
  const updatedAt = Math.max(desk.dataUpdatedAt, passengers.dataUpdatedAt, history.dataUpdatedAt, events.dataUpdatedAt);

  return (
    <section className="mx-auto max-w-7xl space-y-4 px-4 py-4" aria-label={`Flight desk ${d.flight.carrierCode} ${d.flight.flightNumber}`}>
      <p>
        <Link to="/departures" className="font-bold text-harbour underline">
          <span aria-hidden>← </span>Departures
        </Link>
      </p>
      <DeskHeader desk={d} live={<LiveIndicator joined={joined} updatedAt={updatedAt} timeZone={tz} />} />
      {liveState === 'lost' && (
        <p role="alert" className="rounded-lg border-2 border-alert bg-alert-soft px-4 py-3 text-lg font-bold text-alert">
          <span aria-hidden>⚠ </span>No live updates right now: the figures below are as of {formatClock(updatedAt, tz)} and may be out of date. Reconnecting by itself…
        </p>
      )}
      <DeskGlance desk={d} round={roundGlance} />
      <CabinCounts desk={d} />
      <div className="grid gap-4 lg:grid-cols-3">
        <div className="lg:col-span-2">
          <OddsPanel desk={d} history={history.data?.points} />
        </div>
        <div className="space-y-4">
          {canSetShock && d.forecast && <ShockControl flightId={flightId} current={d.forecast.shock} />}
          <EventTrail events={events.data?.events} timeZone={tz} />
        </div>
      </div>
      {volunteerRounds?.(d)}
      {deniedBoarding ? deniedBoarding(d) : <ComingNext what="Denied-boarding review arrives in the next release." />}
      {compensations?.(d)}
      {passengers.error ? (
        <p role="alert" className="font-bold text-alert">
          The passenger list could not be loaded: {passengers.error.message}
        </p>
      ) : (
        <PassengerList passengers={passengers.data?.passengers} timeZone={tz} departureIso={d.flight.scheduledDeparture} />
      )}
    </section>
  );
}

function DeskError({ error }: { error: Error }) {
  const missing = error instanceof ApiRequestError && error.status === 404;
  const title = missing ? 'No such flight at your stations' : 'The flight could not be loaded';
  const heading = useArrival(title);
  return (
    <div role="alert" className="mx-auto mt-10 max-w-xl rounded-lg border-2 border-alert bg-card p-6">
      <h1 ref={heading} tabIndex={-1} className="text-2xl font-bold text-alert">
        {title}
      </h1>
      <p className="mt-2">{missing ? 'The flight may be at another station, or the link is wrong.' : error.message}</p>
      <Link to="/departures" className="mt-4 inline-block font-bold text-harbour underline">
        Back to departures
      </Link>
    </div>
  );
}
