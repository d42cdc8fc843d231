import { useQuery } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { noticeQueryOptions } from '../api/notices';

/** The message as the passenger got it: the HTML part in a sandbox (no scripts, no links followed), and the plain text. */
export function NoticeView({ stationId, id, onClose }: { stationId: number; id: string; onClose: () => void }) {
  const { data, isPending, error } = useQuery(noticeQueryOptions(stationId, id));
  if (isPending) return <p className="text-ink-soft">Opening the message…</p>;
  if (error) return <p role="alert" className="font-bold text-alert">{error.message}</p>;
  return (
    <section aria-labelledby="notice-view-title" className="space-y-3 rounded-lg border-2 border-harbour bg-card p-4">
      <h3 id="notice-view-title" tabIndex={-1} ref={(el) => el?.focus()} className="text-xl font-bold">{data.subject}</h3>
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="font-bold">To</dt><dd>{data.to}</dd>
        <dt className="font-bold">Message id</dt><dd className="font-mono">{data.id}</dd>
        <dt className="font-bold">Kind</dt><dd>{data.kind}</dd>
      </dl>
      {data.html && (
        <div>
          <h4 className="font-bold">As it looked in the mail (HTML part)</h4>
          <iframe title={`The HTML part of “${data.subject}”`} sandbox="" srcDoc={data.html} className="h-72 w-full rounded-md border-2 border-line bg-white" />
        </div>
      )}
      <div>
        <h4 className="font-bold">Plain text</h4>
        <pre className="max-h-72 overflow-auto whitespace-pre-wrap rounded-md border-2 border-line bg-paper p-3 text-sm">{data.text}</pre>
      </div>
      <Button variant="secondary" onClick={onClose}>Close the message</Button>
    </section>
  );
}
