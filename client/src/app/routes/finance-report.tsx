import { ComingNext, Page } from '../../components/ui/page';

export default function FinanceReportPage() {
  return (
    <Page title="Period report">
      <ComingNext what="the quarterly denied-boarding report per station (US Form 251 lines and the EU, UK and Canadian counts)." />
    </Page>
  );
}
