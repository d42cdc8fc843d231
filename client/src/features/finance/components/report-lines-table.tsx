import type { PeriodReport } from '@shared/schemas/finance';
import { formatMoney } from '../../../lib/format';

export function ReportLinesTable({ report }: { report: PeriodReport }) {
  return (
    <table className="w-full border-collapse text-left">
      <caption className="mb-2 text-left text-xl font-bold">{report.title}</caption>
      <thead className="bg-harbour-soft">
        <tr>
          <th scope="col" className="p-2">Line</th>
          <th scope="col" className="p-2">What it counts</th>
          <th scope="col" className="p-2 text-right">Passengers</th>
          <th scope="col" className="p-2 text-right">Amount</th>
        </tr>
      </thead>
      <tbody>
        {report.lines.map((l) => (
          <tr key={l.code} className="border-t border-line align-top">
            <th scope="row" className="p-2">{l.code}</th>
            <td className="p-2">
              {l.label}
              {l.note && <span className="block text-sm text-ink-soft">{l.note}</span>}
              <span className="block text-sm text-ink-soft">Source: {l.source}</span>
            </td>
            <td className="p-2 text-right tabular-nums">{l.count ?? '—'}</td>
            <td className="p-2 text-right tabular-nums">{l.amounts ? (l.amounts.length ? l.amounts.map((a) => formatMoney(a.amountMinor, a.currency)).join(' + ') : formatMoney(0, report.station.currency)) : '—'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
