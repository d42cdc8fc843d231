import { Page } from '../../components/ui/page';
import { ReportScreen } from '../../features/finance/components/report-screen';
import { useCurrentStation } from '../use-current-station';

export default function FinanceReportPage() {
  const { station, stations } = useCurrentStation();
  if (!station) return <Page title="Period report"><p>You do not belong to a station yet. Ask an admin to add you to one.</p></Page>;
  return (
    <Page title="Period report" subtitle="The quarter’s denied-boarding figures per station: US Form 251 lines, or the EU, UK and Canadian counts and sums.">
      <ReportScreen stations={stations} defaultStationId={station.id} />
    </Page>
  );
}
