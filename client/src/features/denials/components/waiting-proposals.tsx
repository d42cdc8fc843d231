import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { formatTime } from '../../../lib/format';
import { waitingProposalsQueryOptions } from '../api/denials';
import { useStationDenialsLive } from '../api/use-denials-live';
import { PROPOSAL_STATUS_WORDS } from '../model/words';

/** Proposed involuntary denials at the station that wait for a supervisor, oldest first. */
export function WaitingDenialProposals({ stationId, timeZone }: { stationId: number; timeZone: string }) {
  const waiting = useQuery(waitingProposalsQueryOptions(stationId));
  useStationDenialsLive(stationId);
  if (waiting.error) return <p role="alert" className="font-bold text-alert">The proposals could not be loaded: {waiting.error.message}</p>;
  if (!waiting.data) return <p className="text-ink-soft">Loading proposals…</p>;
  if (waiting.data.proposals.length === 0) return <p className="text-ink-soft">No denied-boarding proposals wait for you.</p>;
  return (
    <ul className="space-y-2" aria-label="Denied-boarding proposals waiting">
      {waiting.data.proposals.map((p) => (
        <li key={p.id} className="flex flex-wrap items-center justify-between gap-3 rounded-md border-2 border-alert bg-alert-soft px-3 py-2">
          <div>
            <p className="font-bold">
              {p.flight} to {p.destination}, departs {formatTime(p.scheduledDeparture, timeZone)} · {p.seatsSelected} seat{p.seatsSelected === 1 ? '' : 's'} to deny
            </p>
            <p className="text-sm">
              {PROPOSAL_STATUS_WORDS[p.status]} · proposed by {p.proposedBy} at {formatTime(p.proposedAt, timeZone)}: “{p.reason}”
            </p>
          </div>
          <Link to={`/flights/${p.flightId}/bump-review`} className="font-bold text-harbour underline">
            Open bump review<span aria-hidden> →</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
