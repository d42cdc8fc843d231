import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import type { DenialCounts } from '@shared/schemas/denials';
import { Caution, Panel } from '../../../components/ui/page';
import { formatTime } from '../../../lib/format';
import { sessionQueryOptions } from '../../../lib/session';
import { denialCandidatesQueryOptions, denialProposalsQueryOptions } from '../api/denials';
import { useFlightDenialsLive } from '../api/use-denials-live';
import { DenialStatusList } from './denial-status-list';
import { ProposeDenialsForm } from './propose-denials-form';

/** The flight desk's slot for involuntary denials: the live shortfall, the agent's proposal, and where each denial stands. */
export function DeniedBoardingPanel({ flightId, timeZone }: { flightId: number; timeZone: string }) {
  const candidates = useQuery(denialCandidatesQueryOptions(flightId));
  const proposals = useQuery(denialProposalsQueryOptions(flightId));
  const { data: session } = useQuery(sessionQueryOptions());
  useFlightDenialsLive(flightId);
  const role = session?.user?.role;
  const canPropose = role === 'agent' || role === 'supervisor';
  const list = proposals.data?.proposals ?? [];
  const waiting = list.find((p) => p.status === 'proposed' || p.status === 'changed') ?? null;

  return (
    <Panel title="Denied boarding">
      {candidates.error && <p role="alert" className="font-bold text-alert">The ranking could not be loaded: {candidates.error.message}</p>}
      {candidates.data && (
        <div className="space-y-4">
          <ShortfallLine counts={candidates.data.counts} timeZone={timeZone} />
          {canPropose && (
            <ProposeDenialsForm
              flightId={flightId}
              byCabin={candidates.data.counts.byCabin}
              waitingProposalId={waiting?.id ?? null}
              selectableIn={(cabin) => candidates.data.candidates.filter((c) => c.selection === null && c.cabins.includes(cabin)).length}
            />
          )}
          <DenialStatusList proposals={list} timeZone={timeZone} />
          <p>
            <Link to={`/flights/${flightId}/bump-review`} className="font-bold text-harbour underline">
              Open the bump review<span aria-hidden> →</span>
            </Link>{' '}
            <span className="text-ink-soft">— the ranking with reasons, protections and compensation.</span>
          </p>
          <Caution />
        </div>
      )}
      {candidates.isPending && <p className="text-ink-soft">Loading the ranking…</p>}
    </Panel>
  );
}

function ShortfallLine({ counts, timeZone }: { counts: DenialCounts; timeZone: string }) {
  const short = counts.seatsShort;
  const cabins = counts.byCabin.length > 1 ? ` (${counts.byCabin.map((c) => `cabin ${c.cabin}: ${c.occupying} for ${c.seats}`).join('; ')})` : '';
  return (
    <div className={`rounded-md border-2 px-3 py-2 ${short > 0 ? 'border-alert bg-alert-soft' : 'border-line bg-paper'}`} role="status" aria-live="polite">
      <p className="text-lg font-bold">
        {short > 0 ? (
          <>
            <span aria-hidden>⚠ </span>
            {short} seat{short === 1 ? '' : 's'} short now
          </>
        ) : (
          'No seats short now'
        )}
      </p>
      <p className="text-sm">
        {counts.occupying} present (checked in by {formatTime(counts.checkInDeadline, timeZone)} or boarded) for {counts.seats} seats{cabins}
        {counts.acceptedVolunteerSeats > 0 ? `, not counting ${counts.acceptedVolunteerSeats} accepted volunteer${counts.acceptedVolunteerSeats === 1 ? '' : 's'}` : ''}
        {counts.expectedShows !== null ? `; the forecast expects ${counts.expectedShows.toFixed(1)} to show` : ''}
        {counts.waitingProposalSeats > 0 ? `; ${counts.waitingProposalSeats} seat${counts.waitingProposalSeats === 1 ? '' : 's'} already in a proposal` : ''}.
      </p>
    </div>
  );
}
