import { ComingNext, Page } from '../../components/ui/page';

export default function FinanceLedgerPage() {
  return (
    <Page title="Compensation ledger">
      <ComingNext what="every compensation issued, its state at the payment provider and in the ledger, filters, totals and CSV export." />
    </Page>
  );
}
