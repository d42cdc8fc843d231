import { Page } from '../../components/ui/page';
import { ManifestPanel } from '../../features/station-setup/components/manifest-panel';
import { useCurrentStation } from '../use-current-station';
import { useDocumentTitle } from '../use-document-title';

const STEPS = [
  'Download the template: the same columns the server checks, with two invented passengers.',
  'Choose the file your booking system exported. It is checked at once; nothing is stored yet.',
  'Read the preview: who is added, changed or removed on each flight, and every problem with its line, column and rule.',
  'Confirm, after ticking the removals if the file cancels anyone. The import stores everything or nothing.',
];

export default function ManifestImportPage() {
  const { station } = useCurrentStation();
  const title = station ? `Manifest import · ${station.iata}` : 'Manifest import';
  useDocumentTitle(title);
  return (
    <Page title={title} subtitle="Passenger lists from the booking system, checked and previewed before anything changes.">
      {!station ? (
        <p>You do not belong to a station yet.</p>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[1fr_2fr]">
          <ol aria-label="Steps" className="ml-5 list-decimal space-y-2">
            {STEPS.map((s) => <li key={s}>{s}</li>)}
          </ol>
          <ManifestPanel key={station.id} station={station} />
        </div>
      )}
    </Page>
  );
}
