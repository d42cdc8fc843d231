import { ComingNext, Page } from '../../components/ui/page';

export default function FinanceReconciliationPage() {
  return (
    <Page title="Reconciliation">
      <ComingNext what="comparing the ledger with the payment provider’s records and resolving each difference." />
    </Page>
  );
}
