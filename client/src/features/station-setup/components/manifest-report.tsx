import type { ManifestFlightPreview, ManifestImportResult, ManifestProblem } from '@shared/schemas/manifest';
import { useFocusIfLost } from '../../../components/ui/use-focus-if-lost';

/** A file with thousands of bad lines is one mistake repeated: the first few hundred are enough to fix it. */
const SHOWN_PROBLEMS = 200;

export function ProblemsTable({ problems }: { problems: ManifestProblem[] }) {
  const shown = problems.slice(0, SHOWN_PROBLEMS);
  return (
    <div className="space-y-2">
      <div className="max-h-96 overflow-auto rounded-md border-2 border-alert">
        <table className="w-full">
          <caption className="bg-alert-soft px-3 py-2 text-left font-bold">
            {problems.length === 1 ? '1 problem' : `${problems.length} problems`} in the file, by line (the header is line 1)
          </caption>
          <thead className="sticky top-0 bg-card text-left">
            <tr>
              <th scope="col" className="px-3 py-2">Line</th>
              <th scope="col" className="px-3 py-2">Column</th>
              <th scope="col" className="px-3 py-2">Rule</th>
            </tr>
          </thead>
          <tbody>
            {shown.map((p, i) => (
              <tr key={`${p.line}-${p.field}-${i}`} className="border-t border-line align-top">
                <th scope="row" className="px-3 py-1.5 text-left font-mono">{p.line}</th>
                <td className="px-3 py-1.5 font-mono">{p.field}</td>
                <td className="px-3 py-1.5">{p.rule}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {problems.length > shown.length && <p className="text-sm text-ink-soft">Showing the first {shown.length}; fix these and check the file again for the rest.</p>}
    </div>
  );
}

export function FlightsTable({ flights, partial }: { flights: ManifestFlightPreview[]; partial: boolean }) {
  return (
    <table className="w-full">
      <caption className="px-1 py-2 text-left font-bold">
        Flights in the file
        {partial && <span className="ml-2 text-sm font-normal text-ink-soft">(the counts leave out the lines with problems)</span>}
      </caption>
      <thead className="bg-harbour-soft text-left">
        <tr>
          <th scope="col" className="px-3 py-2">Flight</th>
          <th scope="col" className="px-3 py-2">Date</th>
          <th scope="col" className="px-3 py-2">At this station</th>
          <th scope="col" className="px-3 py-2 text-right">Bookings</th>
          <th scope="col" className="px-3 py-2 text-right">Passengers</th>
          <th scope="col" className="px-3 py-2 text-right">Added</th>
          <th scope="col" className="px-3 py-2 text-right">Changed</th>
          <th scope="col" className="px-3 py-2 text-right">Removed</th>
          <th scope="col" className="px-3 py-2 text-right">Seats · most bookings allowed</th>
        </tr>
      </thead>
      <tbody>
        {flights.map((f) => (
          <tr key={`${f.carrier}${f.number}-${f.date}`} className="border-t border-line">
            <th scope="row" className="px-3 py-1.5 text-left">{f.carrier} {f.number}</th>
            <td className="px-3 py-1.5">{f.date}</td>
            <td className="px-3 py-1.5">{f.found ? 'Found' : <strong className="text-alert">✗ Not found</strong>}</td>
            <td className="px-3 py-1.5 text-right">{f.bookings}</td>
            <td className="px-3 py-1.5 text-right">{f.passengers}</td>
            <td className="px-3 py-1.5 text-right"><Counted n={f.diff?.added} names={f.diff?.addedNames} what="added" /></td>
            <td className="px-3 py-1.5 text-right"><Counted n={f.diff?.changed} names={f.diff?.changedNames} what="changed" /></td>
            <td className="px-3 py-1.5 text-right">
              {f.willCancel > 0 ? <Counted n={f.willCancel} names={f.diff?.removedNames} what="will be cancelled" strong /> : '—'}
            </td>
            <td className="px-3 py-1.5 text-right">{f.seats === null ? '—' : `${f.seats} · ${f.bookingLimit}`}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** A count with the names behind it, folded away: who is added, changed or removed. */
function Counted({ n, names, what, strong = false }: { n: number | undefined; names: string[] | undefined; what: string; strong?: boolean }) {
  if (n === undefined) return <>—</>;
  if (n === 0 || !names?.length) return <>{n}</>;
  return (
    <details className="inline-block text-left">
      <summary className={`cursor-pointer ${strong ? 'font-bold text-watch' : ''}`}>{n} {strong ? what : ''}</summary>
      <ul className="mt-1 text-sm" aria-label={`Passengers ${what}`}>
        {names.map((name) => <li key={name}>{name}</li>)}
        {n > names.length && <li className="text-ink-soft">and {n - names.length} more</li>}
      </ul>
    </details>
  );
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

export function ImportResult({ result }: { result: ManifestImportResult }) {
  const t = result.totals;
  // Replaces the Import button: the keyboard continues from the result, and a screen reader reads it.
  const ref = useFocusIfLost<HTMLElement>();
  return (
    <section ref={ref} tabIndex={-1} role="status" aria-label="Import result" className="space-y-2 rounded-md border-l-4 border-calm bg-calm-soft px-4 py-3">
      <p className="text-lg font-bold">
        ✓ Imported {plural(result.rows, 'passenger row', 'passenger rows')} for {plural(result.flights.length, 'flight', 'flights')}.
      </p>
      <table className="w-full bg-card">
        <caption className="sr-only">What the import changed, by flight</caption>
        <thead className="text-left">
          <tr>
            <th scope="col" className="px-3 py-2">Flight</th>
            <th scope="col" className="px-3 py-2 text-right">Bookings new / updated / cancelled</th>
            <th scope="col" className="px-3 py-2 text-right">Passengers new / updated / cancelled</th>
          </tr>
        </thead>
        <tbody>
          {result.flights.map((f) => (
            <tr key={f.flightId} className="border-t border-line">
              <th scope="row" className="px-3 py-1.5 text-left">{f.carrier} {f.number} · {f.date}</th>
              <td className="px-3 py-1.5 text-right">{f.counts.bookingsCreated} / {f.counts.bookingsUpdated} / {f.counts.bookingsCancelled}</td>
              <td className="px-3 py-1.5 text-right">{f.counts.passengersCreated} / {f.counts.passengersUpdated} / {f.counts.passengersCancelled}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-sm">
        In all: {plural(t.passengersCreated, 'new passenger', 'new passengers')}, {t.passengersUpdated} updated, {t.passengersCancelled} cancelled. Check-in and boarding already recorded were kept. The odds are being recomputed.
      </p>
    </section>
  );
}
