import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from 'recharts';
import type { PeriodReport } from '@shared/schemas/finance';
import { ChartFrame } from '../../../components/ui/chart';
import { formatMoney } from '../../../lib/format';

/**
 * Per flight date: paid to volunteers and paid for involuntary denials (stacked, counted as the paid lines count),
 * and what is still owed beside them. The series differ in pattern as well as tone (solid, hatched, outlined), and
 * the figures are also given as a table, so nothing rests on colour alone.
 */
const SERIES: Record<string, string> = { voluntary: 'Paid to volunteers', involuntary: 'Paid for involuntary denials', owed: 'Still owed' };
const LEGEND: Record<string, string> = { voluntary: 'Paid to volunteers (solid)', involuntary: 'Paid for involuntary denials (hatched)', owed: 'Still owed (outlined)' };

export function ReportDayChart({ days, currency }: { days: PeriodReport['perDay']; currency: string }) {
  const data = days.filter((d) => d.currency === currency).map((d) => ({ date: d.date.slice(5), voluntary: d.voluntaryPaidMinor, involuntary: d.involuntaryPaidMinor, owed: d.owedMinor }));
  if (!data.length) return <p className="text-ink-soft">No compensation in {currency} in this quarter.</p>;
  const money = (minor: number) => formatMoney(minor, currency);
  return (
    <figure className="min-w-0">
      <figcaption className="mb-1 font-bold">Per day in {currency}: paid to volunteers, paid for involuntary denials, and still owed</figcaption>
      <ChartFrame testId="report-day-chart">
        <BarChart data={data} responsive style={{ width: '100%', height: 280 }} margin={{ top: 8, right: 12, bottom: 8, left: 8 }}>
          <defs>
            <pattern id="involuntary-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
              <rect width="6" height="6" fill="var(--color-watch)" />
              <line x1="0" y1="0" x2="0" y2="6" stroke="var(--color-watch-soft)" strokeWidth="3" />
            </pattern>
          </defs>
          <CartesianGrid vertical={false} stroke="var(--color-line)" />
          <XAxis dataKey="date" tick={{ fill: 'var(--color-ink)', fontSize: 13 }} />
          <YAxis tickFormatter={(v: number) => money(v)} tick={{ fill: 'var(--color-ink)', fontSize: 13 }} width={96} />
          <Tooltip formatter={(v, name) => [money(Number(v)), SERIES[String(name)] ?? String(name)]} contentStyle={{ fontSize: 15, borderWidth: 2 }} />
          <Legend formatter={(name) => LEGEND[String(name)] ?? String(name)} />
          <Bar dataKey="voluntary" stackId="paid" fill="var(--color-harbour)" isAnimationActive={false} />
          <Bar dataKey="involuntary" stackId="paid" fill="url(#involuntary-hatch)" isAnimationActive={false} />
          <Bar dataKey="owed" fill="var(--color-paper)" stroke="var(--color-alert)" strokeWidth={2} strokeDasharray="4 2" isAnimationActive={false} />
        </BarChart>
      </ChartFrame>
    </figure>
  );
}
