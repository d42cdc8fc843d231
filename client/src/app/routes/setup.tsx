import { Page, Panel } from '../../components/ui/page';
import { UsersAdmin } from '../../features/users/components/users-admin';
import { StationsOverview } from '../../features/stations/components/stations-overview';

export default function SetupPage() {
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
    </Page>
  );
}
