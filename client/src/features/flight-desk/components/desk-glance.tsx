import type { ReactNode } from 'react';
import type { FlightDesk } from '@shared/schemas/flight-desk';
import { Announce } from '../../../components/ui/announce';
import { formatPercent } from '../../../lib/format';
import { formatTolerance, RISK_LOOK, riskLevel } from '../model/risk';

/**
 * The desk at a glance, right under the flight's header so it fits above the fold at 1366×768: the live counts, the
 * odds, the volunteer target and the current round. The sections below give the detail of each.
 */
export function DeskGlance({ desk, round }: { desk: FlightDesk; round?: ReactNode }) {
  const { totals, forecast: f } = desk;
  const look = f ? RISK_LOOK[riskLevel(f.pOversale)] : null;
  const target = f?.volunteerTarget ?? 0;
  // Only counts and levels: the sentence changes when the gate's picture changes, never with the clock.
  const sentence =
    `${totals.checkedIn} checked in, ${totals.boarded} boarded, ${totals.booked} booked for ${totals.seats} seats.` +
    (f && look ? ` ${look.word}. ${target > 0 ? `${target} volunteers wanted.` : 'No volunteers needed.'}` : '');
  return (
    <section aria-label="At a glance" className="grid gap-3 rounded-lg border-2 border-line bg-card p-3 md:grid-cols-2 xl:grid-cols-4" data-testid="desk-glance">
      <Announce message={sentence} />
      <Cell label="Checked in · boarded">
        <span className="text-3xl tabular-nums" data-testid="glance-checked-in">{totals.checkedIn}</span>
        <span className="text-xl tabular-nums"> · {totals.boarded}</span>
        <span className="block text-base font-normal">
          of {totals.booked} booked, {totals.seats} seats
          {totals.booked > totals.seats && <strong className="text-alert"> ({totals.booked - totals.seats} over)</strong>}
        </span>
      </Cell>
      <Cell label="Odds of an oversale">
        {f && look ? (
          <>
            <span className={`inline-flex items-center gap-1.5 text-3xl tabular-nums ${look.text}`}>
              <span aria-hidden>{look.icon}</span>
              {formatPercent(f.pOversale)}
            </span>
            <span className={`block text-base ${look.text}`}>{look.word}</span>
          </>
        ) : (
          <span className="text-base font-normal">Not computed yet</span>
        )}
      </Cell>
      <Cell label="Volunteers wanted">
        {f ? (
          <>
            <span className="text-3xl tabular-nums" data-testid="glance-target">{target}</span>
            <span className="block text-base font-normal">
              {target > 0 ? `to bring the risk under ${formatTolerance(f.riskTolerance)}` : `risk already under ${formatTolerance(f.riskTolerance)}`}
            </span>
          </>
        ) : (
          <span className="text-base font-normal">Not computed yet</span>
        )}
      </Cell>
      <Cell label="Current round">{round ?? <span className="text-base font-normal">—</span>}</Cell>
    </section>
  );
}

function Cell({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="rounded-md bg-paper px-3 py-2">
      <p className="text-sm font-bold tracking-wide text-ink-soft uppercase">{label}</p>
      <div className="font-bold">{children}</div>
    </div>
  );
}
