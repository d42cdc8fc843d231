import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { regimeLabel } from '@shared/compensation/labels';
import { Caution, Page, Panel } from '../../../components/ui/page';
import { ApiRequestError } from '../../../lib/api-client';
import { formatTime, zoneLabel } from '../../../lib/format';
import { sessionQueryOptions } from '../../../lib/session';
import { denialCandidatesQueryOptions, denialProposalsQueryOptions } from '../api/denials';
import { useFlightDenialsLive } from '../api/use-denials-live';
import { CandidateRanking, ExcludedList } from './candidate-ranking';
import { peopleOf, RecordedDenialForm, RefusalForm, RefusalList } from './other-outcomes';
import { ProposalReview } from './proposal-review';

/**
 * The supervisor's review of proposed involuntary denials: why each passenger stands where they do, who is protected,
 * what each would be owed, and the decisions. Agents see the same, read-only.
 */
export function BumpReview({ flightId }: { flightId: number }) {
  const candidates = useQuery(denialCandidatesQueryOptions(flightId));
  const proposals = useQuery(denialProposalsQueryOptions(flightId));
  const { data: session } = useQuery(sessionQueryOptions());
  useFlightDenialsLive(flightId);

  if (candidates.error) {
    const missing = candidates.error instanceof ApiRequestError && candidates.error.status === 404;
    return (
      <Page title="Bump review">
        <p role="alert" className="font-bold text-alert">{missing ? 'No such flight at your stations.' : candidates.error.message}</p>
      </Page>
    );
  }
  if (!candidates.data) return <p className="p-6 text-lg text-ink-soft">Loading the ranking…</p>;

  const c = candidates.data;
  const user = session?.user ?? null;
  const tz = user?.stations.find((s) => s.id === c.flight.stationId)?.timeZone ?? 'UTC';
  const decides = user?.role === 'supervisor' || user?.role === 'admin';
  const authorizes = user?.role === 'supervisor';
  const list = proposals.data?.proposals ?? [];

  return (
    <Page
      title={`Bump review · ${c.flight.label} to ${c.flight.destination}`}
      subtitle={`Departs ${formatTime(c.flight.scheduledDeparture, tz)} from ${c.flight.origin}. Times in ${zoneLabel(tz)}. Rules of ${regimeLabel(c.regime)}.`}
      actions={
        <Link to={`/flights/${flightId}`} className="font-bold text-harbour underline no-print">
          <span aria-hidden>← </span>Flight desk
        </Link>
      }
    >
      <div className="space-y-4">
        <Caution>
          Bumpboard computes what the configured rules say. The applicable regulation, the contract of carriage and the carrier’s compliance staff decide who is
          denied boarding and what is owed.
        </Caution>
        {!decides && <p className="rounded-md bg-harbour-soft px-3 py-2">You can follow this review; a supervisor authorizes and changes the selection.</p>}
        <Counts counts={c.counts} />
        <Panel title="Proposals">
          {proposals.error && <p role="alert" className="font-bold text-alert">{proposals.error.message}</p>}
          {list.length === 0 && !proposals.isPending && <p className="text-ink-soft">Nothing proposed yet. Agents propose from the flight desk.</p>}
          <div className="space-y-6">
            {list.map((p) => (
              <ProposalReview key={p.id} proposal={p} flightId={flightId} timeZone={tz} userId={user?.id ?? null} decides={decides} authorizes={authorizes} candidates={c.candidates} />
            ))}
          </div>
        </Panel>
        <div className="grid gap-4 xl:grid-cols-2">
          <Panel title="Refusals of carriage (not a denial)">
            <div className="space-y-4">
              <RefusalList flightId={flightId} timeZone={tz} />
              {(user?.role === 'agent' || authorizes) && <RefusalForm flightId={flightId} people={peopleOf(c)} />}
            </div>
          </Panel>
          {authorizes && (
            <Panel title="Record a denial after the fact">
              <RecordedDenialForm flightId={flightId} people={peopleOf(c)} timeZone={tz} />
            </Panel>
          )}
        </div>
        <div className="grid gap-4 xl:grid-cols-[3fr_2fr]">
          <Panel title="Ranking: who would be selected, in order">
            <CandidateRanking candidates={c.candidates} />
          </Panel>
          <div className="space-y-4">
            <Panel title="Never selected: not present, boarded, volunteers or protected">
              <ExcludedList excluded={c.excluded} />
            </Panel>
            <Panel title="The station’s boarding priorities">
              <ul className="list-disc space-y-1 pl-5">
                {c.rulesText.map((line) => (
                  <li key={line}>{line}</li>
                ))}
              </ul>
            </Panel>
          </div>
        </div>
      </div>
    </Page>
  );
}

function Counts({ counts }: { counts: { seats: number; checkedIn: number; boarded: number; acceptedVolunteerSeats: number; seatsShort: number; waitingProposalSeats: number; expectedShows: number | null } }) {
  const items: [string, string][] = [
    ['Seats', String(counts.seats)],
    ['Checked in', String(counts.checkedIn)],
    ['Boarded', String(counts.boarded)],
    ['Accepted volunteers', String(counts.acceptedVolunteerSeats)],
    ['Expected to show', counts.expectedShows === null ? '—' : counts.expectedShows.toFixed(1)],
    ['Short now', String(counts.seatsShort)],
    ['In waiting proposals', String(counts.waitingProposalSeats)],
  ];
  return (
    <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4 lg:grid-cols-7" aria-label="Live counts">
      {items.map(([label, value]) => (
        <div key={label} className={`rounded-md border-2 bg-card px-3 py-2 ${label === 'Short now' && counts.seatsShort > 0 ? 'border-alert' : 'border-line'}`}>
          <dt className="text-sm text-ink-soft">{label}</dt>
          <dd className="text-2xl font-bold">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
