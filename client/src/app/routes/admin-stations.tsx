import { Page } from '../../components/ui/page';
import { StationsAdmin } from '../../features/admin-stations/components/stations-admin';
import { useDocumentTitle } from '../use-document-title';

export default function AdminStationsPage() {
  useDocumentTitle('Stations');
  return (
    <Page title="Stations" subtitle="Each station’s code, time zone, passenger-rights rules, currency and the limits it works by.">
      <StationsAdmin />
    </Page>
  );
}
