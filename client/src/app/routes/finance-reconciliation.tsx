import { Page } from '../../components/ui/page';
import { ReconciliationScreen } from '../../features/finance/components/reconciliation-screen';
import { useCurrentStation } from '../use-current-station';

export default function FinanceReconciliationPage() {
  const { stations } = useCurrentStation();
  return (
    <Page title="Reconciliation" subtitle="The ledger compared with the payment provider’s cards, and each difference resolved with a note.">
      <ReconciliationScreen stations={stations} />
    </Page>
  );
}
