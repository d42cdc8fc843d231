import { Page } from '../../components/ui/page';
import { AuditViewer } from '../../features/audit-viewer/components/audit-viewer';
import { useCurrentStation } from '../use-current-station';
import { useDocumentTitle } from '../use-document-title';

export default function AuditLogPage() {
  const { station } = useCurrentStation();
  const title = station ? `Audit log · ${station.iata}` : 'Audit log';
  useDocumentTitle(title);
  return (
    <Page title={title} subtitle="Who did what and when at this station: filter by flight, person, action and time; export as CSV.">
      {!station ? <p>You do not belong to a station yet.</p> : <AuditViewer key={station.id} station={station} />}
    </Page>
  );
}
