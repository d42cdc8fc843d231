import { ComingNext, Page, Panel } from '../../components/ui/page';
import { DeparturesBoard } from '../../features/departures/components/departures-board';
import { zoneLabel } from '../../lib/format';
import { useCurrentStation } from '../use-current-station';

export default function StationDayPage() {
  const { station } = useCurrentStation();
  if (!station) return <Page title="Station day"><p>You do not belong to a station yet.</p></Page>;
  return (
    <Page title={`Station day · ${station.iata}`} subtitle={`What needs a supervisor today at ${station.name}. Times in ${zoneLabel(station.timeZone)}.`}>
      <div className="space-y-4">
        <Panel title="Waiting for you">
          <ComingNext what="approvals of offers above the agent’s limit and the bump review of proposed involuntary denials arrive here." />
        </Panel>
        <Panel title="Departures">
          <DeparturesBoard stationId={station.id} timeZone={station.timeZone} />
        </Panel>
      </div>
    </Page>
  );
}
