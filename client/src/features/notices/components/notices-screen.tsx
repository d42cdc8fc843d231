import { useId, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { NOTICE_STATES, type NoticesQuery, type StationNotice } from '@shared/schemas/admin-notices';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { noticesQueryOptions, useNoticeAction } from '../api/notices';
import { NoticeView } from './notice-view';
import { ResultMessage } from '../../../components/ui/form-problems';

/** Date and time on the station's clock, e.g. "3 Dec 2026, 07:40". */
const when = (iso: string, timeZone: string) => new Intl.DateTimeFormat('en-GB', { timeZone, dateStyle: 'medium', timeStyle: 'short', hourCycle: 'h23' }).format(new Date(iso));

const STATE_WORDS: Record<StationNotice['status'], string> = { pending: 'Waiting to send', sent: 'Sent', failed: 'Failed' };

export function NoticesScreen({ station }: { station: { id: number; iata: string; timeZone: string } }) {
  const statusId = useId();
  const [filters, setFilters] = useState<NoticesQuery>({});
  const [words, setWords] = useState('');
  const [open, setOpen] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const list = useQuery(noticesQueryOptions(station.id, filters));
  const act = useNoticeAction(station.id);

  const run = (n: StationNotice, action: 'retry' | 'resend') =>
    act.mutate({ id: n.id, action }, {
      onSuccess: () => setMessage(action === 'retry' ? `“${n.subject}” to ${n.to} is queued again with fresh tries; it goes out within a minute.` : `A copy of “${n.subject}” is queued for ${n.to}; the original stays on record.`),
    });

  return (
    <div className="space-y-4">
      <ResultMessage text={message} />
      {act.error && <p role="alert" className="font-bold text-alert">{act.error.message}</p>}
      {list.data && (
        <p className="text-ink-soft" data-testid="notice-counts">
          {list.data.counts.sent} sent · {list.data.counts.pending} waiting · <strong className={list.data.counts.failed ? 'text-alert' : ''}>{list.data.counts.failed} failed</strong> at {station.iata}
        </p>
      )}
      <form className="flex flex-wrap items-end gap-3" onSubmit={(e) => { e.preventDefault(); setFilters((f) => ({ ...f, q: words || undefined })); }}>
        <div>
          <label htmlFor={statusId} className="mb-1 block font-bold">State</label>
          <select id={statusId} className="min-h-11 rounded-md border-2 border-line bg-card px-3 py-2 text-lg" value={filters.status ?? ''} onChange={(e) => setFilters((f) => ({ ...f, status: (e.target.value || undefined) as NoticesQuery['status'] }))}>
            <option value="">Every state</option>
            {NOTICE_STATES.map((s) => <option key={s} value={s}>{STATE_WORDS[s]}</option>)}
          </select>
        </div>
        <TextField label="Recipient or subject" value={words} onChange={setWords} />
        <Button type="submit" variant="secondary">Search</Button>
      </form>
      {open && <NoticeView key={open} stationId={station.id} id={open} onClose={() => setOpen(null)} />}
      {list.isPending && <p className="text-ink-soft">Loading notices…</p>}
      {list.error && <p role="alert" className="font-bold text-alert">{list.error.message}</p>}
      {list.data && (
        <div className="overflow-x-auto">
          <table className="w-full">
            <caption className="mb-2 text-left text-ink-soft">Newest first, at most {list.data.limit}; times in {station.iata} local time.</caption>
            <thead className="bg-harbour-soft text-left">
              <tr>
                <th className="px-2 py-2">Recipient</th><th className="px-2 py-2">Subject</th><th className="px-2 py-2">Flight</th><th className="px-2 py-2">State</th>
                <th className="px-2 py-2">Tries</th><th className="px-2 py-2">Queued</th><th className="px-2 py-2"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {list.data.notices.map((n) => (
                <tr key={n.id} className="border-t border-line align-top">
                  <td className="px-2 py-2 break-all">{n.to}</td>
                  <td className="px-2 py-2">{n.subject}{n.resendOf && <span className="block text-sm text-ink-soft">a copy sent again</span>}</td>
                  <td className="px-2 py-2">{n.flight?.label ?? '—'}</td>
                  <td className="px-2 py-2">
                    <span className={n.status === 'failed' ? 'font-bold text-alert' : n.status === 'sent' ? 'text-calm' : ''}>{STATE_WORDS[n.status]}</span>
                    {n.lastError && n.status !== 'sent' && <span className="block text-sm text-ink-soft">{n.lastError}</span>}
                  </td>
                  <td className="px-2 py-2">{n.attempts}</td>
                  <td className="px-2 py-2 whitespace-nowrap">{when(n.createdAt, station.timeZone)}{n.sentAt && <span className="block text-sm text-ink-soft">sent {when(n.sentAt, station.timeZone)}</span>}</td>
                  <td className="px-2 py-2 text-right whitespace-nowrap">
                    <Button variant="quiet" aria-label={`Open “${n.subject}” to ${n.to}`} onClick={() => setOpen(n.id)}>Open</Button>
                    {n.status === 'failed' && <Button variant="secondary" disabled={act.isPending} aria-label={`Retry “${n.subject}” to ${n.to}`} onClick={() => run(n, 'retry')}>Retry</Button>}
                    {n.status === 'sent' && <Button variant="secondary" disabled={act.isPending} aria-label={`Send “${n.subject}” to ${n.to} again`} onClick={() => run(n, 'resend')}>Send again</Button>}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {list.data.notices.length === 0 && <p className="py-3 text-ink-soft">No notices match.</p>}
        </div>
      )}
    </div>
  );
}
