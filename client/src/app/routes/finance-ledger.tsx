import { Page } from '../../components/ui/page';
import { AlertsList } from '../../features/alerts/components/alerts-list';
import { CareLedgerPanel } from '../../features/finance/components/care-ledger-panel';
import { LedgerScreen } from '../../features/finance/components/ledger-screen';
import { useCurrentStation } from '../use-current-station';

export default function FinanceLedgerPage() {
  const { stations } = useCurrentStation();
  return (
    <Page title="Compensation ledger" subtitle="Every compensation of your stations: what is owed, what is paid, and what the payment provider holds.">
      <AlertsList linkFlights={false} hint="Payments lost or near their deadline. The passengers are still owed: re-issue from the ledger below, giving the reason." />
      <LedgerScreen stations={stations} />
      <CareLedgerPanel stations={stations} />
    </Page>
  );
}
