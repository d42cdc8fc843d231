import { Page } from '../../components/ui/page';
import { ReconciliationScreen } from '../../features/finance/components/reconciliation-screen';
import { useCurrentStation } from '../use-current-station';

export default function FinanceReconciliationPage() {
  const { stations } = useCurrentStation();
  return (
    <Page title="Reconciliation" subtitle="Each medium compared with its own record (cards and transfers at the provider, the drawers and the cheque register), and each difference resolved with a note.">
      <ReconciliationScreen stations={stations} />
    </Page>
  );
}
