import { Page } from '../../components/ui/page';
import { AlertsList } from '../../features/alerts/components/alerts-list';
import { DeparturesBoard } from '../../features/departures/components/departures-board';
import { zoneLabel } from '../../lib/format';
import { useCurrentStation } from '../use-current-station';

export default function DeparturesPage() {
  const { station } = useCurrentStation();
  if (!station) return <Page title="Departures"><p>You do not belong to a station yet. Ask an admin to add you to one.</p></Page>;
  return (
    <Page title={`Departures · ${station.iata}`} subtitle={`${station.name}. Times in ${zoneLabel(station.timeZone)}.`}>
      <AlertsList stationId={station.id} hint="The passengers are still owed. Open the flight and re-issue from its compensation panel, giving the reason." />
      <DeparturesBoard stationId={station.id} timeZone={station.timeZone} />
    </Page>
  );
}
