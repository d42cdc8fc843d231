import { Bar, BarChart, CartesianGrid, Cell, ReferenceArea, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import { ChartFrame, ChartTable } from '../../../components/ui/chart';
import { formatPercent } from '../../../lib/format';
import { mostLikelyShows, showsBars } from '../model/distribution';

const HATCH_ID = 'shows-over-capacity-hatch';

/**
 * P(shows = k) as bars with the seat count as a line. Bars past the line are in the alert tone *and* hatched, with
 * a label over that side, so the meaning survives without colour.
 */
export function ShowsChart({ pmf, capacity }: { pmf: number[]; capacity: number }) {
  const bars = showsBars(pmf, capacity);
  if (bars.length === 0) return null;
  const lo = bars[0].shows;
  const hi = bars[bars.length - 1].shows;
  const likely = mostLikelyShows(pmf);
  return (
    <figure className="min-w-0">
      <figcaption className="mb-1 font-bold">How many people will show</figcaption>
      <p className="sr-only">
        Chart of the chance of each number of people showing. Most likely {likely} people for {capacity} seats.
      </p>
      <ChartFrame testId="shows-chart">
        <BarChart data={bars} responsive style={{ width: '100%', height: 250 }} margin={{ top: 28, right: 12, bottom: 22, left: 0 }} barCategoryGap={1}>
          <defs>
            <pattern id={HATCH_ID} width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
              <rect width="6" height="6" fill="var(--color-alert)" />
              <line x1="0" y1="0" x2="0" y2="6" stroke="var(--color-alert-soft)" strokeWidth="3" />
            </pattern>
          </defs>
          <CartesianGrid vertical={false} stroke="var(--color-line)" />
          <ReferenceArea x1={capacity + 0.5} x2={hi + 0.5} fill="var(--color-alert-soft)" fillOpacity={0.6} ifOverflow="hidden" />
          <XAxis
            dataKey="shows"
            type="number"
            domain={[lo - 0.5, hi + 0.5]}
            allowDecimals={false}
            tick={{ fill: 'var(--color-ink)', fontSize: 14 }}
            label={{ value: 'People who show', position: 'insideBottom', offset: -14, fill: 'var(--color-ink)', fontSize: 14 }}
          />
          <YAxis tickFormatter={(v: number) => `${Math.round(v * 100)} %`} tick={{ fill: 'var(--color-ink)', fontSize: 14 }} width={52} />
          <Tooltip
            formatter={(v) => [formatPercent(Number(v)), 'Chance']}
            labelFormatter={(k) => `${k} people show`}
            contentStyle={{ fontSize: 16, borderWidth: 2 }}
          />
          <Bar dataKey="p" isAnimationActive={false}>
            {bars.map((b) => (
              <Cell key={b.shows} fill={b.over ? `url(#${HATCH_ID})` : 'var(--color-harbour)'} />
            ))}
          </Bar>
          <ReferenceLine
            x={capacity + 0.5}
            stroke="var(--color-ink)"
            strokeWidth={3}
            label={{ value: `${capacity} seats`, position: 'top', fill: 'var(--color-ink)', fontWeight: 700, fontSize: 15 }}
          />
        </BarChart>
      </ChartFrame>
      <ul className="mt-1 flex flex-wrap gap-x-5 gap-y-1 text-sm">
        <li className="flex items-center gap-2">
          <span aria-hidden className="inline-block h-4 w-4 bg-harbour" />
          Everyone gets a seat
        </li>
        <li className="flex items-center gap-2 font-bold text-alert">
          <svg aria-hidden width="16" height="16" className="inline-block">
            <rect width="16" height="16" fill={`url(#${HATCH_ID})`} />
          </svg>
          More people than seats: someone is denied boarding
        </li>
      </ul>
      <ChartTable
        summary="The chances as a table"
        caption={`Chance of each number of people showing, for ${capacity} seats`}
        columns={['People who show', 'Chance', 'Enough seats?']}
        rows={bars.map((b) => [b.shows, formatPercent(b.p), b.over ? 'No: someone is denied boarding' : 'Yes'])}
      />
    </figure>
  );
}
