import { Page, Panel } from '../../components/ui/page';
import { UsersAdmin } from '../../features/users/components/users-admin';
import { StationsOverview } from '../../features/stations/components/stations-overview';
import { ShowUpProfileEditor } from '../../features/station-setup/components/show-up-profile-editor';
import { ManifestPanel } from '../../features/station-setup/components/manifest-panel';
import { IntegrationKeysPanel } from '../../features/station-setup/components/integration-keys-panel';
import { VolunteerPolicyEditor } from '../../features/volunteer-rounds/components/volunteer-policy-editor';
import { PriorityRulesEditor } from '../../features/denials/components/priority-rules-editor';
import { CareSetupEditor } from '../../features/care-setup/components/care-setup-editor';
import { useCurrentStation } from '../use-current-station';

export default function SetupPage() {
  const { station } = useCurrentStation();
  return (
    <Page title="Station setup" subtitle="People, stations and the rules each station works by.">
      <div className="grid gap-4 lg:grid-cols-[2fr_1fr]">
        <Panel title="Users">
          <UsersAdmin />
        </Panel>
        <Panel title="Your stations">
          <StationsOverview />
        </Panel>
      </div>
      {station && (
        <section aria-labelledby="station-tools" className="mt-8 space-y-4">
          <header>
            <h2 id="station-tools" className="text-2xl font-bold text-harbour">
              {station.iata} · {station.name}
            </h2>
            <p className="text-ink-soft">The tools below work on this station. Choose another station at the top of the page.</p>
          </header>
          <Panel title={`Show-up profile · ${station.iata}`}>
            <ShowUpProfileEditor station={station} />
          </Panel>
          <Panel title={`Manifest upload · ${station.iata}`}>
            <ManifestPanel key={station.id} station={station} />
          </Panel>
          <Panel title={`Integration keys · ${station.iata}`}>
            <IntegrationKeysPanel key={station.id} station={station} />
          </Panel>
          <Panel title={`Volunteer policy · ${station.iata}`}>
            <VolunteerPolicyEditor key={station.id} stationId={station.id} />
          </Panel>
          <Panel title={`Boarding priorities for denied boarding · ${station.iata}`}>
            <PriorityRulesEditor key={station.id} stationId={station.id} />
          </Panel>
          <Panel title={`Care for waiting passengers · ${station.iata}`}>
            <CareSetupEditor key={station.id} stationId={station.id} />
          </Panel>
        </section>
      )}
    </Page>
  );
}
