import { useId, useState, type FormEvent } from 'react';
import { useInfiniteQuery } from '@tanstack/react-query';
import { localToInstant } from '@shared/time';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { auditCsvUrl, auditQueryOptions, type AuditFilters } from '../api/audit';

/** Date and time on the station's clock, e.g. "3 Dec 2026, 07:40". */
const when = (iso: string, timeZone: string) => new Intl.DateTimeFormat('en-GB', { timeZone, dateStyle: 'medium', timeStyle: 'short', hourCycle: 'h23' }).format(new Date(iso));

const show = (v: unknown) => (v === undefined ? '—' : typeof v === 'string' ? v : JSON.stringify(v));

/** What changed, field by field: only the fields that differ when both sides are there, else every field recorded. */
function changes(before: unknown, after: unknown): { key: string; text: string }[] {
  const obj = (v: unknown) => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : null);
  const b = obj(before);
  const a = obj(after);
  if (!b && !a) return before == null && after == null ? [] : [{ key: 'value', text: `${show(before)} → ${show(after)}` }];
  const keys = [...new Set([...Object.keys(b ?? {}), ...Object.keys(a ?? {})])];
  return keys
    .filter((k) => !(b && a) || JSON.stringify(b[k]) !== JSON.stringify(a[k]))
    .map((k) => ({ key: k, text: b && a ? `${show(b[k])} → ${show(a[k])}` : show((a ?? b ?? {})[k]) }));
}

/** Reads a typed local time as the station's clock; an unreadable one is a problem named with its field. */
function instant(field: string, local: string, timeZone: string): string | undefined {
  if (!local) return undefined;
  try {
    return localToInstant(field, local, timeZone);
  } catch (err) {
    throw new ApiRequestError(400, { error: 'invalid_request', message: (err as Error).message, details: [{ field, rule: (err as Error).message.replace(`${field}: `, '') }] });
  }
}

export function AuditViewer({ station }: { station: { id: number; iata: string; timeZone: string } }) {
  const actionId = useId();
  const [form, setForm] = useState({ flightId: '', actor: '', action: '', from: '', to: '' });
  const [filters, setFilters] = useState<AuditFilters>({});
  const [problem, setProblem] = useState<ApiRequestError | null>(null);
  const list = useInfiniteQuery(auditQueryOptions(station.id, filters));
  const set = (k: keyof typeof form) => (v: string) => setForm((f) => ({ ...f, [k]: v }));
  const error = problem ?? (list.error instanceof ApiRequestError ? list.error : null);
  const fieldError = (f: string) => error?.fieldMessage(f);

  function apply(e: FormEvent) {
    e.preventDefault();
    try {
      setProblem(null);
      setFilters({ flightId: form.flightId ? Number(form.flightId) : undefined, actor: form.actor || undefined, action: form.action || undefined, from: instant('from', form.from, station.timeZone), to: instant('to', form.to, station.timeZone) });
    } catch (err) {
      setProblem(err as ApiRequestError);
    }
  }

  const rows = list.data?.pages.flatMap((p) => p.rows) ?? [];
  const actions = list.data?.pages[0]?.actions ?? [];
  return (
    <div className="space-y-4">
      <form onSubmit={apply} noValidate className="grid items-start gap-3 sm:grid-cols-3 lg:grid-cols-6">
        <TextField label="Flight id" inputMode="numeric" value={form.flightId} onChange={set('flightId')} error={fieldError('flightId')} hint="The number in the flight desk's address" />
        <TextField label="Person" value={form.actor} onChange={set('actor')} error={fieldError('actor')} hint="Part of an e-mail or key name" />
        <div>
          <label htmlFor={actionId} className="mb-1 block font-bold">Action</label>
          <select id={actionId} value={form.action} onChange={(e) => set('action')(e.target.value)} className="min-h-11 w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg">
            <option value="">Every action</option>
            {[...new Set(actions.map((a) => `${a.split('.')[0]}.`))].map((p) => <option key={p} value={p}>{p}* (all)</option>)}
            {actions.map((a) => <option key={a} value={a}>{a}</option>)}
          </select>
        </div>
        <TextField label="From" type="datetime-local" value={form.from} onChange={set('from')} error={fieldError('from')} hint={`${station.iata} local time`} />
        <TextField label="To" type="datetime-local" value={form.to} onChange={set('to')} error={fieldError('to')} hint={`${station.iata} local time`} />
        <div className="flex gap-2 sm:mt-8">
          <Button type="submit">Show</Button>
          <a href={auditCsvUrl(station.id, filters)} download className="inline-flex min-h-11 items-center rounded-md border-2 border-harbour bg-card px-4 py-2 font-bold text-harbour hover:bg-harbour-soft">CSV</a>
        </div>
      </form>
      {error && <p role="alert" className="font-bold text-alert">Not shown: {error.body.details?.map((d) => `${d.field}: ${d.rule}`).join('; ') ?? error.message}</p>}
      <p role="status" className="text-ink-soft">{list.isPending ? 'Loading the log…' : `${rows.length}${list.hasNextPage ? '+' : ''} row${rows.length === 1 ? '' : 's'} shown, newest first. The CSV holds every row of this filter.`}</p>
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="sr-only">Audit log of {station.iata}</caption>
          <thead className="bg-harbour-soft text-left">
            <tr><th className="px-2 py-2">When ({station.iata})</th><th className="px-2 py-2">Who</th><th className="px-2 py-2">Action</th><th className="px-2 py-2">What</th><th className="px-2 py-2">Changes (before → after)</th></tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className="border-t border-line align-top">
                <td className="px-2 py-2 whitespace-nowrap">{when(r.at, station.timeZone)}</td>
                <td className="px-2 py-2 break-all">{r.actor}</td>
                <td className="px-2 py-2 font-mono">{r.action}</td>
                <td className="px-2 py-2">{r.entityType} {r.entityId}</td>
                <td className="px-2 py-2">
                  <ul className="max-w-xl">
                    {changes(r.before, r.after).map((c) => (
                      <li key={c.key} className="break-all"><span className="font-bold">{c.key}</span>: {c.text}</li>
                    ))}
                  </ul>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {list.hasNextPage && <Button variant="secondary" disabled={list.isFetchingNextPage} onClick={() => list.fetchNextPage()}>{list.isFetchingNextPage ? 'Loading…' : 'Show older rows'}</Button>}
    </div>
  );
}
