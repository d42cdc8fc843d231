import type { ReactNode } from 'react';
import type { FlightDesk } from '@shared/schemas/flight-desk';
import { Panel } from '../../../components/ui/page';
import { RiskWords } from './risk-words';
import { cabinName } from '../model/words';

/** Bookings and progress through the gate by cabin, each against the seats that cabin has. */
export function CabinCounts({ desk }: { desk: FlightDesk }) {
  const { cabins, totals, forecast } = desk;
  const expectedTotal = cabins.reduce((a, c) => a + c.expectedShows, 0);
  return (
    <Panel title="Counts by cabin">
      <div className="overflow-x-auto">
        <table className="w-full text-2xl tabular-nums">
          <caption className="sr-only">Seats, bookings, check-ins, boarded passengers, expected shows and oversale odds by cabin</caption>
          <thead>
            <tr className="border-b-2 border-line text-left text-base text-ink-soft">
              <th scope="col" className="py-1 pr-3">Cabin</th>
              <Num header>Seats</Num>
              <Num header>Booked</Num>
              <Num header>Checked in</Num>
              <Num header>Boarded</Num>
              <Num header>Expected to show</Num>
              <th scope="col" className="py-1 pl-6">Oversale odds</th>
            </tr>
          </thead>
          <tbody>
            {cabins.map((c) => (
              <tr key={c.cabin} className="border-b border-line" data-testid={`cabin-${c.cabin}`}>
                <th scope="row" className="py-2 pr-3 text-left text-xl">{cabinName(c.cabin)}</th>
                <Num>{c.seats}</Num>
                <Booked booked={c.booked} seats={c.seats} />
                <Num testId={`cabin-${c.cabin}-checked-in`}>{c.checkedIn}</Num>
                <Num>{c.boarded}</Num>
                <Num>{c.expectedShows.toFixed(1)}</Num>
                <td className="py-2 pl-6 text-base">
                  <RiskWords p={c.pOversale} />
                </td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr className="font-bold">
              <th scope="row" className="py-2 pr-3 text-left text-xl">All cabins</th>
              <Num>{totals.seats}</Num>
              <Booked booked={totals.booked} seats={totals.seats} />
              <Num testId="total-checked-in">{totals.checkedIn}</Num>
              <Num testId="total-boarded">{totals.boarded}</Num>
              <Num>{expectedTotal.toFixed(1)}</Num>
              <td className="py-2 pl-6 text-base">{forecast && <RiskWords p={forecast.pOversale} />}</td>
            </tr>
          </tfoot>
        </table>
      </div>
    </Panel>
  );
}

function Num({ children, header = false, testId }: { children: ReactNode; header?: boolean; testId?: string }) {
  if (header) return <th scope="col" className="px-3 py-1 text-right">{children}</th>;
  return (
    <td className="px-3 py-2 text-right" data-testid={testId}>
      {children}
    </td>
  );
}

function Booked({ booked, seats }: { booked: number; seats: number }) {
  const over = booked - seats;
  return (
    <td className="px-3 py-2 text-right">
      <span className={over > 0 ? 'font-bold' : ''}>{booked}</span>
      {over > 0 && (
        <span className="ml-2 text-base font-bold text-alert">
          <span aria-hidden>▲ </span>+{over} over seats
        </span>
      )}
    </td>
  );
}
