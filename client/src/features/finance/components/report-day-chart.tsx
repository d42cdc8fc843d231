import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from 'recharts';
import type { PeriodReport } from '@shared/schemas/finance';
import { formatMoney } from '../../../lib/format';

/**
 * Compensation per flight date, volunteers and involuntary denials stacked. The two series differ in pattern as well
 * as tone (solid and hatched), and the figures are also given as a table, so nothing rests on colour alone.
 */
export function ReportDayChart({ days, currency }: { days: PeriodReport['perDay']; currency: string }) {
  const data = days.filter((d) => d.currency === currency).map((d) => ({ date: d.date.slice(5), voluntary: d.voluntaryMinor, involuntary: d.involuntaryMinor }));
  if (!data.length) return <p className="text-ink-soft">No compensation in {currency} in this quarter.</p>;
  const money = (minor: number) => formatMoney(minor, currency);
  return (
    <figure className="min-w-0">
      <figcaption className="mb-1 font-bold">Compensation per day in {currency}, volunteers and involuntary denials</figcaption>
      <div aria-hidden data-testid="report-day-chart">
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
          <Tooltip formatter={(v, name) => [money(Number(v)), name === 'voluntary' ? 'Volunteers' : 'Involuntary denials']} contentStyle={{ fontSize: 15, borderWidth: 2 }} />
          <Legend formatter={(name) => (name === 'voluntary' ? 'Volunteers (solid)' : 'Involuntary denials (hatched)')} />
          <Bar dataKey="voluntary" stackId="day" fill="var(--color-harbour)" isAnimationActive={false} />
          <Bar dataKey="involuntary" stackId="day" fill="url(#involuntary-hatch)" isAnimationActive={false} />
        </BarChart>
      </div>
    </figure>
  );
}
