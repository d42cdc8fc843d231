import { Page } from '../../components/ui/page';
import { NoticesScreen } from '../../features/notices/components/notices-screen';
import { useCurrentStation } from '../use-current-station';
import { useDocumentTitle } from '../use-document-title';

export default function NoticesPage() {
  const { station } = useCurrentStation();
  const title = station ? `Notices · ${station.iata}` : 'Notices';
  useDocumentTitle(title);
  return (
    <Page title={title} subtitle="Every e-mail to passengers: sent, waiting or failed, with its tries; open one as the passenger saw it, retry or send again.">
      {!station ? <p>You do not belong to a station yet.</p> : <NoticesScreen key={station.id} station={station} />}
    </Page>
  );
}
