import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Caution, Panel } from '../../../components/ui/page';
import { formatMoney } from '../../../lib/format';
import { reportCsvHref, reportQueryOptions } from '../api/finance-api';
import { recentQuarters } from '../model/quarters';
import { DownloadLink, SelectField, type StationOption } from './field';
import { ReportDayChart } from './report-day-chart';
import { ReportLinesTable } from './report-lines-table';
import { ReportMediaTable } from './report-media-table';

export function ReportScreen({ stations, defaultStationId, now = new Date() }: { stations: StationOption[]; defaultStationId: number; now?: Date }) {
  const quarters = recentQuarters(now, 8);
  const [quarter, setQuarter] = useState(quarters[0]);
  const [stationId, setStationId] = useState(defaultStationId);
  const { data, error, isPending } = useQuery(reportQueryOptions(quarter, stationId));
  return (
    <div className="space-y-4">
      <Panel>
        <div className="flex flex-wrap items-end gap-3">
          <SelectField label="Quarter" value={quarter} onChange={setQuarter}>
            {quarters.map((q) => <option key={q} value={q}>{q}</option>)}
          </SelectField>
          <SelectField label="Station" value={String(stationId)} onChange={(v) => setStationId(Number(v))}>
            {stations.map((s) => <option key={s.id} value={s.id}>{s.iata} · {s.name}</option>)}
          </SelectField>
          <DownloadLink href={reportCsvHref(quarter, stationId)}>Export CSV</DownloadLink>
        </div>
      </Panel>
      <Caution />
      {isPending && <p className="text-ink-soft">Loading the report…</p>}
      {error && <p role="alert" className="font-bold text-alert">{error.message}</p>}
      {data && (
        <>
          <Panel>
            <p className="mb-3 text-ink-soft">{data.station.iata} · {data.station.name} · flights from {data.from} to {data.to}</p>
            <ReportLinesTable report={data} />
            <ul className="mt-3 list-disc pl-5 text-sm text-ink-soft">{data.notes.map((n) => <li key={n}>{n}</li>)}</ul>
          </Panel>
          <Panel title="By medium">
            <div className="overflow-x-auto"><ReportMediaTable lines={data.byMedium} /></div>
          </Panel>
          <Panel>
            <ReportDayChart days={data.perDay} currency={data.station.currency} />
            <table className="mt-3 w-full border-collapse text-left text-sm">
              <caption className="sr-only">Per day: paid and still owed (the same figures as the chart)</caption>
              <thead><tr><th scope="col" className="p-1">Date</th><th scope="col" className="p-1 text-right">Paid to volunteers</th><th scope="col" className="p-1 text-right">Paid for involuntary denials</th><th scope="col" className="p-1 text-right">Still owed</th></tr></thead>
              <tbody>
                {data.perDay.map((d) => (
                  <tr key={`${d.date}-${d.currency}`} className="border-t border-line">
                    <td className="p-1">{d.date}</td>
                    <td className="p-1 text-right tabular-nums">{formatMoney(d.voluntaryPaidMinor, d.currency)}</td>
                    <td className="p-1 text-right tabular-nums">{formatMoney(d.involuntaryPaidMinor, d.currency)}</td>
                    <td className="p-1 text-right tabular-nums">{formatMoney(d.owedMinor, d.currency)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </Panel>
        </>
      )}
    </div>
  );
}
