import type { PlannerInput } from '@shared/schemas/planner';
import { formatMoney, formatPercent } from '../../../lib/format';
import type { PlannerResult } from '../model/curve';
import { CurveChart } from './curve-chart';
import { CurveTable } from './curve-table';

function signed(minor: number, currency: string): string {
  return `${minor >= 0 ? '+' : '−'}${formatMoney(Math.abs(minor), currency)}`;
}

/** The answer first, in one line; then the chart and the table that show why. */
export function PlanResult({ input, result }: { input: PlannerInput; result: PlannerResult }) {
  const { best, bestPoint, atCapacity } = result;
  const currency = input.currency;
  const bestNet = Math.round(best.expectedNet);
  const gain = bestNet - Math.round(atCapacity.expectedNet);
  const over = best.bookings - input.capacity;
  const summary = `Expected net revenue and oversale risk by bookings accepted: ${input.capacity} seats, show rate ${input.showProbability}, ${formatMoney(input.revenuePerBookingMinor, currency)} per booking, ${formatMoney(input.costPerDenialMinor, currency)} per denied boarding${input.rho === undefined ? '' : `, rho ${input.rho}`}. The best row is marked.`;
  return (
    <div className="space-y-4">
      <div aria-live="polite" className="rounded-md border-l-8 border-signal bg-paper px-4 py-3">
        <p className="text-3xl font-bold text-harbour">
          Best: {best.bookings} bookings, expected net {formatMoney(bestNet, currency)}
        </p>
        <p className="mt-1 text-lg">
          {over === 0 ? 'Do not overbook: sell only the seats.' : `${over} more than the ${input.capacity} seats.`} Oversale risk at {best.bookings}: <strong>{formatPercent(bestPoint.pOversale)}</strong>, on average{' '}
          <strong>{bestPoint.expectedDenied.toFixed(2)}</strong> passengers without a seat.
        </p>
        <p className="text-lg">
          Selling only the {input.capacity} seats: {formatMoney(Math.round(atCapacity.expectedNet), currency)} ({signed(gain, currency)} with the best limit).
        </p>
        {best.atSearchLimit && (
          <p className="mt-1 font-bold text-watch">Every extra booking still paid off up to the search limit of {best.bookings}: the true best may be higher. Check the cost per denied boarding.</p>
        )}
      </div>
      <CurveChart points={result.chart} bestBookings={best.bookings} capacity={input.capacity} currency={currency} />
      <CurveTable rows={result.table} curve={result.chart} bestBookings={best.bookings} capacity={input.capacity} currency={currency} summary={summary} />
    </div>
  );
}
