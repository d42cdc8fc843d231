import { Page } from '../../components/ui/page';
import { FlightsAdmin } from '../../features/admin-flights/components/flights-admin';
import { useCurrentStation } from '../use-current-station';
import { useDocumentTitle } from '../use-document-title';

export default function AdminFlightsPage() {
  const { station } = useCurrentStation();
  const title = station ? `Flights · ${station.iata}` : 'Flights';
  useDocumentTitle(title);
  return (
    <Page title={title} subtitle="Add a flight by hand, change its time, seats or gate, or cancel it.">
      {!station ? <p>You do not belong to a station yet.</p> : <FlightsAdmin key={station.id} station={station} />}
    </Page>
  );
}
