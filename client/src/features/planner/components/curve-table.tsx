import type { BookingLimitPoint } from '@shared/forecast';
import { formatMoney, formatPercent } from '../../../lib/format';

interface Props {
  rows: BookingLimitPoint[];
  /** Every computed point, so each row can show what its last booking added. */
  curve: BookingLimitPoint[];
  bestBookings: number;
  capacity: number;
  currency: string;
  summary: string;
}

function signedMoney(minor: number, currency: string): string {
  const rounded = Math.round(minor);
  return `${rounded > 0 ? '+' : rounded < 0 ? '−' : '±'}${formatMoney(Math.abs(rounded), currency)}`;
}

/** The curve as a real table, for keyboard and screen-reader users and for reading exact figures. */
export function CurveTable({ rows, curve, bestBookings, capacity, currency, summary }: Props) {
  const netAt = new Map(curve.map((p) => [p.bookings, p.expectedNet]));
  const gapAfterFirst = rows.length > 1 && rows[1].bookings !== rows[0].bookings + 1;
  return (
    <div role="region" aria-label="Curve, booking by booking" tabIndex={0} className="overflow-x-auto rounded-md border-2 border-line focus:border-harbour">
      <table className="w-full border-collapse text-base">
        <caption className="bg-card px-3 py-2 text-left font-bold">
          {summary}
        </caption>
        <thead className="bg-harbour-soft text-left">
          <tr>
            <th scope="col" className="px-3 py-2">Bookings</th>
            <th scope="col" className="px-3 py-2 text-right">Over the seats</th>
            <th scope="col" className="px-3 py-2 text-right">Expected net</th>
            <th scope="col" className="px-3 py-2 text-right">Last booking adds</th>
            <th scope="col" className="px-3 py-2 text-right">Oversale risk</th>
            <th scope="col" className="px-3 py-2 text-right">Expected without a seat</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((p, i) => {
            const best = p.bookings === bestBookings;
            const previous = netAt.get(p.bookings - 1);
            return (
              <tr key={p.bookings} className={`border-t border-line ${best ? 'bg-signal font-bold' : ''} ${i === 1 && gapAfterFirst ? 'border-t-4' : ''}`}>
                <th scope="row" className="whitespace-nowrap px-3 py-1.5 text-left">
                  {p.bookings}
                  {best && (
                    <>
                      {' '}
                      <span className="ml-1 rounded bg-ink px-2 py-0.5 text-sm text-white">Best</span>
                    </>
                  )}
                </th>
                <td className="px-3 py-1.5 text-right tabular-nums">{p.bookings - capacity}</td>
                <td className="px-3 py-1.5 text-right tabular-nums">{formatMoney(Math.round(p.expectedNet), currency)}</td>
                <td className="px-3 py-1.5 text-right tabular-nums">{previous === undefined ? '—' : signedMoney(p.expectedNet - previous, currency)}</td>
                <td className="px-3 py-1.5 text-right tabular-nums">{formatPercent(p.pOversale)}</td>
                <td className="px-3 py-1.5 text-right tabular-nums">{p.expectedDenied.toFixed(2)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
