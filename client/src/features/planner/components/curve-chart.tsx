import { useId } from 'react';
import { CartesianGrid, ComposedChart, Line, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import type { BookingLimitPoint } from '@shared/forecast';
import { ChartFrame } from '../../../components/ui/chart';
import { formatMoney, formatPercent } from '../../../lib/format';
import { minorDigits } from '../model/money-text';

interface Props {
  points: BookingLimitPoint[];
  bestBookings: number;
  capacity: number;
  currency: string;
}

const NET_NAME = 'Expected net revenue';
const RISK_NAME = 'Oversale risk';

/** Axis ticks in whole currency units: cents on an axis only add noise. */
function axisMoney(major: number, currency: string): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency, notation: 'compact', maximumFractionDigits: 1 }).format(major);
}

function Swatch({ dashed, vertical, colour }: { dashed?: boolean; vertical?: boolean; colour: string }) {
  return (
    <svg width="36" height="16" aria-hidden className="shrink-0">
      {vertical ? (
        <line x1="18" y1="0" x2="18" y2="16" stroke={colour} strokeWidth="3" />
      ) : (
        <line x1="0" y1="8" x2="36" y2="8" stroke={colour} strokeWidth="4" strokeDasharray={dashed ? '8 5' : undefined} />
      )}
    </svg>
  );
}

/** Expected net revenue and oversale risk against bookings; the table below carries the same figures in words. */
export function CurveChart({ points, bestBookings, capacity, currency }: Props) {
  const captionId = useId();
  // the chart works in major units so its axis gets round ticks; figures in words stay exact in minor units
  const scale = 10 ** minorDigits(currency);
  const data = points.map((p) => ({ bookings: p.bookings, expectedNet: Math.round(p.expectedNet) / scale, pOversale: p.pOversale }));
  return (
    <figure aria-labelledby={captionId} className="space-y-2">
      <ul className="flex flex-wrap gap-x-6 gap-y-1 font-bold" aria-hidden>
        <li className="flex items-center gap-2 text-harbour">
          <Swatch colour="var(--color-harbour)" /> {NET_NAME} (left scale)
        </li>
        <li className="flex items-center gap-2 text-alert">
          <Swatch dashed colour="var(--color-alert)" /> {RISK_NAME} (right scale)
        </li>
        <li className="flex items-center gap-2">
          <Swatch vertical colour="var(--color-ink)" /> Best number of bookings
        </li>
      </ul>
      <ChartFrame testId="planner-curve-chart">
      <ComposedChart responsive data={data} style={{ width: '100%', height: 380 }} margin={{ top: 28, right: 8, bottom: 28, left: 8 }}>
        <CartesianGrid stroke="var(--color-line)" strokeDasharray="3 3" />
        <XAxis
          dataKey="bookings"
          type="number"
          domain={['dataMin', 'dataMax']}
          allowDecimals={false}
          tick={{ fill: 'var(--color-ink)', fontSize: 15 }}
          label={{ value: `Bookings accepted (${capacity} seats)`, position: 'insideBottom', offset: -18, fill: 'var(--color-ink)', fontSize: 15, fontWeight: 700 }}
        />
        <YAxis yAxisId="net" width={76} tickCount={6} tick={{ fill: 'var(--color-harbour)', fontSize: 15 }} tickFormatter={(v: number) => axisMoney(v, currency)} domain={['auto', 'auto']} />
        <YAxis yAxisId="risk" orientation="right" width={60} domain={[0, 1]} ticks={[0, 0.25, 0.5, 0.75, 1]} tick={{ fill: 'var(--color-alert)', fontSize: 15 }} tickFormatter={(v: number) => `${Math.round(v * 100)} %`} />
        <Tooltip
          labelFormatter={(label) => `${String(label)} bookings`}
          formatter={(value, name) => (name === RISK_NAME ? formatPercent(Number(value)) : formatMoney(Math.round(Number(value) * scale), currency))}
          contentStyle={{ fontSize: 15, borderColor: 'var(--color-line)' }}
        />
        <Line yAxisId="net" name={NET_NAME} type="monotone" dataKey="expectedNet" stroke="var(--color-harbour)" strokeWidth={4} dot={false} isAnimationActive={false} />
        <Line yAxisId="risk" name={RISK_NAME} type="monotone" dataKey="pOversale" stroke="var(--color-alert)" strokeWidth={3} strokeDasharray="8 5" dot={false} isAnimationActive={false} />
        <ReferenceLine
          yAxisId="net"
          x={bestBookings}
          stroke="var(--color-ink)"
          strokeWidth={2}
          label={{ value: `Best: ${bestBookings}`, position: 'top', fill: 'var(--color-ink)', fontSize: 16, fontWeight: 700 }}
        />
      </ComposedChart>
      </ChartFrame>
      <figcaption id={captionId} className="text-sm text-ink-soft">
        Expected net revenue and the chance that more passengers show than there are seats, for each number of bookings accepted. The table below lists the same figures.
      </figcaption>
    </figure>
  );
}
