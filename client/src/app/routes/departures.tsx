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
      <AlertsList stationId={station.id} hint="Newest first, each with what to do next. “I am on it” tells your colleagues someone has it; “Dismiss” closes a notice." />
      <DeparturesBoard stationId={station.id} timeZone={station.timeZone} />
    </Page>
  );
}
