import { Page } from '../../components/ui/page';
import { LedgerScreen } from '../../features/finance/components/ledger-screen';
import { useCurrentStation } from '../use-current-station';

export default function FinanceLedgerPage() {
  const { stations } = useCurrentStation();
  return (
    <Page title="Compensation ledger" subtitle="Every compensation of your stations: what is owed, what the payment provider holds, and what was voided.">
      <LedgerScreen stations={stations} />
    </Page>
  );
}
