import type { DenialProposal } from '@shared/schemas/denials';
import { formatTime } from '../../../lib/format';
import { denialStatusWords, PROPOSAL_STATUS_WORDS } from '../model/words';

/** Where each proposal and each of its denials stands, newest first; kept live by the flight's change notices. */
export function DenialStatusList({ proposals, timeZone }: { proposals: DenialProposal[]; timeZone: string }) {
  if (proposals.length === 0) return <p className="text-ink-soft">No denials proposed on this flight.</p>;
  return (
    <ul className="space-y-3" aria-label="Denial proposals">
      {proposals.map((p) => (
        <li key={p.id} className="rounded-md border-2 border-line p-3">
          <p className="font-bold">
            Proposal {p.id} · {PROPOSAL_STATUS_WORDS[p.status]} · {p.seatsSelected} of {p.seatsNeeded} seat{p.seatsNeeded === 1 ? '' : 's'}
          </p>
          <p className="text-sm text-ink-soft">
            By {p.proposedBy} at {formatTime(p.proposedAt, timeZone)}: “{p.reason}”
          </p>
          <ul className="mt-2 space-y-1">
            {p.denials.map((d) => (
              <li key={d.id} data-denial-status={d.status}>
                <span className="font-bold">{d.pnr}</span> {d.names.join(', ')} — {denialStatusWords(d, timeZone)}
              </li>
            ))}
          </ul>
        </li>
      ))}
    </ul>
  );
}
