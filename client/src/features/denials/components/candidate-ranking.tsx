import { useState } from 'react';
import type { DenialCandidates } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { PRIORITY_GROUP_WORDS, PROTECTION_WORDS } from '../model/words';

/** Enough rows to see who is next without scrolling past the whole flight; the rest on request. */
const FIRST_ROWS = 12;

/** The ranking with the reasons for each position, so a supervisor can see why, not just who. */
export function CandidateRanking({ candidates }: { candidates: DenialCandidates['candidates'] }) {
  const [all, setAll] = useState(false);
  if (candidates.length === 0) return <p className="text-ink-soft">Nobody on this flight can be selected.</p>;
  const shown = all ? candidates : candidates.slice(0, FIRST_ROWS);
  return (
    <div>
      <table className="w-full text-left" aria-label="Ranked candidates">
        <thead>
          <tr className="border-b-2 border-line text-sm">
            <th scope="col" className="py-1 pr-2">#</th>
            <th scope="col" className="py-1 pr-2">Booking</th>
            <th scope="col" className="py-1 pr-2">Seats</th>
            <th scope="col" className="py-1">Why here</th>
          </tr>
        </thead>
        <tbody>
          {shown.map((c) => (
            <tr key={c.unitId} className={`border-b border-line align-top ${c.selection ? 'bg-harbour-soft' : ''}`}>
              <td className="py-1 pr-2 text-lg font-bold">{c.position}</td>
              <td className="py-1 pr-2">
                <span className="font-bold">{c.pnr}</span> {c.names.join(', ')}
                {c.priorityGroup && <span className="ml-2 rounded bg-calm-soft px-2 text-sm font-bold text-calm">{PRIORITY_GROUP_WORDS[c.priorityGroup]}</span>}
                {c.selection && (
                  <span className="ml-2 rounded bg-harbour px-2 text-sm font-bold text-white">
                    {c.selection.status === 'authorized' ? 'Authorized' : `In proposal ${c.selection.proposalId}`}
                  </span>
                )}
              </td>
              <td className="py-1 pr-2">{c.seatsFreed}</td>
              <td className="py-1">
                <details>
                  <summary className="cursor-pointer text-sm text-harbour">{c.reasons[1] ?? c.reasons[0]}</summary>
                  <ul className="mt-1 list-disc pl-5 text-sm">
                    {c.reasons.map((r) => (
                      <li key={r}>{r}</li>
                    ))}
                  </ul>
                </details>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {candidates.length > FIRST_ROWS && (
        <Button variant="quiet" className="mt-2" onClick={() => setAll(!all)} aria-expanded={all}>
          {all ? `Show the first ${FIRST_ROWS}` : `Show all ${candidates.length}`}
        </Button>
      )}
    </div>
  );
}

export function ExcludedList({ excluded }: { excluded: DenialCandidates['excluded'] }) {
  if (excluded.length === 0) return <p className="text-ink-soft">Nobody set aside on this flight.</p>;
  return (
    <ul className="space-y-2" aria-label="Passengers set aside">
      {excluded.map((e) => (
        <li key={e.passengerId}>
          <span className="font-bold">{e.name}</span> <span className="text-ink-soft">({e.pnr})</span>{' '}
          <span className="rounded bg-calm-soft px-2 text-sm font-bold text-calm">{PROTECTION_WORDS[e.protection] ?? e.protection}</span>
          <p className="text-sm">{e.reason}</p>
        </li>
      ))}
    </ul>
  );
}
