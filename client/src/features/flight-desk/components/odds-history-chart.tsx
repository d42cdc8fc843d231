import { CartesianGrid, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import { ChartFrame, ChartTable } from '../../../components/ui/chart';
import { formatPercent, formatTime } from '../../../lib/format';
import { formatTolerance } from '../model/risk';
import { percentScaleTop } from '../model/scale';

export interface OddsPoint {
  at: string;
  pOversale: number;
}

/** The odds of an oversale since the gate opened, as steps: the figure changes when an event arrives, not between. */
export function OddsHistoryChart({ points, riskTolerance, timeZone }: { points: OddsPoint[]; riskTolerance: number; timeZone: string }) {
  const data = points.map((p) => ({ t: new Date(p.at).getTime(), pct: p.pOversale * 100 })).sort((a, b) => a.t - b.t);
  const first = data[0];
  const last = data[data.length - 1];
  const top = percentScaleTop(Math.max(0, ...data.map((d) => d.pct)), riskTolerance * 100);
  return (
    <figure className="min-w-0">
      <figcaption className="mb-1">
        <span className="font-bold">Odds of an oversale over time</span>
        <span className="ml-3 text-sm text-ink-soft">dashed line: the {formatTolerance(riskTolerance)} target</span>
      </figcaption>
      {data.length < 2 ? (
        <p className="text-ink-soft">Not enough history yet: the line starts once the odds have been computed twice.</p>
      ) : (
        <>
          <p className="sr-only">
            From {formatPercent(first.pct / 100)} at {formatTime(new Date(first.t).toISOString(), timeZone)} to {formatPercent(last.pct / 100)} at {formatTime(new Date(last.t).toISOString(), timeZone)}.
          </p>
          <ChartFrame testId="odds-history-chart">
            <LineChart data={data} responsive style={{ width: '100%', height: 170 }} margin={{ top: 10, right: 16, bottom: 0, left: 0 }}>
              <CartesianGrid vertical={false} stroke="var(--color-line)" />
              <XAxis
                dataKey="t"
                type="number"
                scale="time"
                domain={['dataMin', 'dataMax']}
                tickFormatter={(t: number) => formatTime(new Date(t).toISOString(), timeZone)}
                tick={{ fill: 'var(--color-ink)', fontSize: 14 }}
              />
              <YAxis domain={[0, top]} tickFormatter={(v: number) => `${v} %`} tick={{ fill: 'var(--color-ink)', fontSize: 14 }} width={52} />
              <Tooltip
                formatter={(v) => [formatPercent(Number(v) / 100), 'Odds of an oversale']}
                labelFormatter={(t) => formatTime(new Date(Number(t)).toISOString(), timeZone)}
                contentStyle={{ fontSize: 16, borderWidth: 2 }}
              />
              <ReferenceLine
                y={riskTolerance * 100}
                stroke="var(--color-calm)"
                strokeDasharray="6 4"
                strokeWidth={2}
              />
              <Line type="stepAfter" dataKey="pct" stroke="var(--color-harbour)" strokeWidth={3} dot={false} isAnimationActive={false} />
            </LineChart>
          </ChartFrame>
          <ChartTable
            summary="The odds as a table"
            caption="Odds of an oversale at each change"
            columns={['Time', 'Odds of an oversale']}
            rows={data.map((d) => [formatTime(new Date(d.t).toISOString(), timeZone), formatPercent(d.pct / 100)])}
          />
        </>
      )}
    </figure>
  );
}

