import { Page } from '../../components/ui/page';
import { SchedulesAdmin } from '../../features/schedules/components/schedules-admin';
import { useCurrentStation } from '../use-current-station';
import { useDocumentTitle } from '../use-document-title';

export default function SchedulesPage() {
  const { station } = useCurrentStation();
  const title = station ? `Weekly schedules · ${station.iata}` : 'Weekly schedules';
  useDocumentTitle(title);
  return (
    <Page title={title} subtitle="A flight number that flies on set weekdays between two dates; saving one keeps its dated flights in step.">
      {!station ? <p>You do not belong to a station yet.</p> : <SchedulesAdmin key={station.id} station={station} />}
    </Page>
  );
}
