import { Page, Panel } from '../../components/ui/page';
import { AlertsList } from '../../features/alerts/components/alerts-list';
import { DeparturesBoard } from '../../features/departures/components/departures-board';
import { PendingApprovals } from '../../features/volunteer-rounds/components/pending-approvals';
import { WaitingDenialProposals } from '../../features/denials/components/waiting-proposals';
import { zoneLabel } from '../../lib/format';
import { useCurrentStation } from '../use-current-station';

export default function StationDayPage() {
  const { station } = useCurrentStation();
  if (!station) return <Page title="Station day"><p>You do not belong to a station yet.</p></Page>;
  return (
    <Page title={`Station day · ${station.iata}`} subtitle={`What needs a supervisor today at ${station.name}. Times in ${zoneLabel(station.timeZone)}.`}>
      <AlertsList stationId={station.id} hint="Newest first, each with what to do next. “I am on it” tells your colleagues someone has it; “Dismiss” closes a notice." />
      <div className="space-y-4">
        <Panel title="Waiting for you">
          <PendingApprovals stationId={station.id} timeZone={station.timeZone} />
          <div className="mt-4">
            <h3 className="mb-2 text-lg font-bold">Denied-boarding proposals</h3>
            <WaitingDenialProposals stationId={station.id} timeZone={station.timeZone} />
          </div>
        </Panel>
        <Panel title="Departures">
          <DeparturesBoard stationId={station.id} timeZone={station.timeZone} />
        </Panel>
      </div>
    </Page>
  );
}
