import type { ReactNode } from 'react';
import type { FlightDesk, Forecast } from '@shared/schemas/flight-desk';
import { Caution, Panel } from '../../../components/ui/page';
import { formatPercent, formatTime } from '../../../lib/format';
import { formatTolerance, RISK_LOOK, riskLevel } from '../model/risk';
import { describeShock } from '../model/shock';
import { OddsHistoryChart, type OddsPoint } from './odds-history-chart';
import { ShowsChart } from './shows-chart';

/** The odds at a glance: one big number in words, what it means for the gate, then the shape behind it. */
export function OddsPanel({ desk, history }: { desk: FlightDesk; history: OddsPoint[] | undefined }) {
  const f = desk.forecast;
  const tz = desk.station.timeZone;
  if (!f) {
    return (
      <Panel title="Odds of an oversale">
        <p className="text-lg">The odds for this flight have not been computed yet. They appear here as soon as the first bookings are in.</p>
      </Panel>
    );
  }
  const look = RISK_LOOK[riskLevel(f.pOversale)];
  return (
    <Panel title="Odds of an oversale">
      <div className="grid gap-5 md:grid-cols-[17rem_1fr]">
        <div className="space-y-3">
          <div className={`rounded-lg border-2 px-4 py-3 ${look.panel}`} data-testid="odds-headline">
            <p className={`flex items-center gap-2 text-2xl font-bold ${look.text}`}>
              <span aria-hidden>{look.icon}</span>
              {look.word}
            </p>
            <p className="whitespace-nowrap text-5xl leading-tight font-bold tabular-nums xl:text-6xl" data-testid="p-oversale">
              {formatPercent(f.pOversale)}
            </p>
            <p>chance that more people show than the {f.capacity} seats</p>
          </div>
          <VolunteerTarget forecast={f} />
          <dl className="divide-y divide-line text-lg">
            <Stat label="Expected denied boardings" testId="expected-denied">
              {f.expectedDenied.toFixed(1)}
            </Stat>
            <Stat label="Expected to show" testId="expected-shows">
              {f.mean.toFixed(1)} <span className="text-base font-normal text-ink-soft">± {f.sd.toFixed(1)}</span>
            </Stat>
            <Stat label="Full or over">{formatPercent(f.pFullOrOver)}</Stat>
          </dl>
        </div>
        <ShowsChart pmf={f.pmf} capacity={f.capacity} />
      </div>
      <div className="mt-4">
        <OddsHistoryChart points={history ?? []} riskTolerance={f.riskTolerance} timeZone={tz} />
      </div>
      <p className="mt-3 text-sm text-ink-soft">
        Common shock: {describeShock(f.shock)}. Computed at {formatTime(f.computedAt, tz)}.
      </p>
      <div className="mt-2">
        <Caution>These odds are a model’s estimate from booking and check-in data, not a promise. The gate count decides who boards.</Caution>
      </div>
    </Panel>
  );
}

function VolunteerTarget({ forecast: f }: { forecast: Forecast }) {
  const tolerance = formatTolerance(f.riskTolerance);
  if (f.volunteerTarget <= 0) {
    return (
      <p className="rounded-md border-2 border-calm bg-calm-soft px-3 py-2 text-lg font-bold text-calm" data-testid="volunteer-target">
        <span aria-hidden>● </span>No volunteers needed: the risk is already under {tolerance}.
      </p>
    );
  }
  return (
    <p className="rounded-md border-2 border-ink bg-signal px-3 py-2 text-xl font-bold text-ink" data-testid="volunteer-target">
      Line up {f.volunteerTarget} {f.volunteerTarget === 1 ? 'volunteer' : 'volunteers'} to bring the risk under {tolerance}
    </p>
  );
}

function Stat({ label, children, testId }: { label: string; children: ReactNode; testId?: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3 py-1">
      <dt className="text-ink-soft">{label}</dt>
      <dd className="text-xl font-bold whitespace-nowrap tabular-nums" data-testid={testId}>
        {children}
      </dd>
    </div>
  );
}
