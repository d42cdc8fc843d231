import { useParams } from 'react-router-dom';
import { ComingNext, Page } from '../../components/ui/page';

export default function FlightDeskPage() {
  const { flightId } = useParams();
  return (
    <Page title="Flight desk" subtitle={`Flight ${flightId}`}>
      <ComingNext what="the live flight desk (counts by cabin, the odds panel, the passenger list and the event trail)." />
    </Page>
  );
}
