import { useParams } from 'react-router-dom';
import { Page } from '../../components/ui/page';
import { FlightDesk } from '../../features/flight-desk/components/flight-desk';
import { VolunteerRoundsPanel } from '../../features/volunteer-rounds/components/volunteer-rounds-panel';
import { RoundGlance } from '../../features/volunteer-rounds/components/round-glance';
import { DeniedBoardingPanel } from '../../features/denials/components/denied-boarding-panel';
import { CompensationsPanel } from '../../features/desk-compensations/components/compensations-panel';
import { DeskCarePanel } from '../../features/desk-care/components/desk-care-panel';
import { useQuery } from '@tanstack/react-query';
import { sessionQueryOptions } from '../../lib/session';

export default function FlightDeskPage() {
  const { flightId } = useParams();
  const id = Number(flightId);
  // Only agents handle compensation money; the API refuses everyone else, so nobody else gets the panel.
  const { data: session } = useQuery(sessionQueryOptions());
  const isAgent = session?.user?.role === 'agent';
  if (!Number.isInteger(id) || id <= 0) {
    return (
      <Page title="Flight desk">
        <p role="alert">“{flightId}” is not a flight number this screen knows. Open a flight from Departures.</p>
      </Page>
    );
  }
  // A new flight is a new desk: no filter, sort or form state carries over from the previous one.
  return (
    <FlightDesk
      key={id}
      flightId={id}
      roundGlance={<RoundGlance flightId={id} />}
      volunteerRounds={(d) => (
        <VolunteerRoundsPanel flightId={id} station={d.station} forecast={d.forecast} flightLabel={`${d.flight.carrierCode} ${d.flight.flightNumber} to ${d.flight.destination}`}
          arrival={d.flight.destinationTimeZone ? { airport: d.flight.destination, timeZone: d.flight.destinationTimeZone } : undefined}
        />
      )}
      deniedBoarding={(d) => (
        <>
          <DeniedBoardingPanel flightId={id} timeZone={d.station.timeZone} />
          <DeskCarePanel flightId={id} />
        </>
      )}
      compensations={isAgent ? () => <CompensationsPanel flightId={id} /> : undefined}
    />
  );
}
