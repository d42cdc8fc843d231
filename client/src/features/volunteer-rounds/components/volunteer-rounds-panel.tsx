import { useQuery } from '@tanstack/react-query';
import type { Round } from '@shared/schemas/volunteers';
import { Panel } from '../../../components/ui/page';
import { formatTime } from '../../../lib/format';
import { sessionQueryOptions } from '../../../lib/session';
import { roundsQueryOptions } from '../api/rounds';
import { useRoundsLive } from '../api/use-live';
import { seatsFoundWords } from '../model/round-words';
import { OpenRound } from './open-round';
import { OpenRoundForm } from './open-round-form';
import type { ArrivalClock } from './rebook-panel';

/** What the panel needs of the station the flight leaves from. */
export interface RoundsStation {
  id: number;
  timeZone: string;
}

export interface VolunteerRoundsPanelProps {
  flightId: number;
  station: RoundsStation;
  /** The flight's forecast: its volunteer target prefills how many volunteers a new round asks for. */
  forecast: { volunteerTarget: number } | null;
  /** Shown on the gate screen's QR view, e.g. "ZZ 105 to ORD". */
  flightLabel?: string;
  /** The destination airport and its zone: arrival times there are typed and shown on its clock. */
  arrival?: ArrivalClock;
}

/** The volunteer rounds of one flight on the flight desk: open one, run it live, and see the earlier ones. */
export function VolunteerRoundsPanel({ flightId, station, forecast, flightLabel, arrival }: VolunteerRoundsPanelProps) {
  const rounds = useQuery(roundsQueryOptions(flightId));
  const role = useQuery(sessionQueryOptions()).data?.user?.role;
  useRoundsLive(flightId);

  if (rounds.isPending) return <Panel title="Volunteer rounds"><p className="text-lg text-ink-soft">Loading the volunteer rounds…</p></Panel>;
  if (rounds.error) {
    return (
      <Panel title="Volunteer rounds">
        <p role="alert" className="font-bold text-alert">The volunteer rounds could not be loaded: {rounds.error.message}</p>
      </Panel>
    );
  }
  const { policy, bidLink } = rounds.data;
  const open = rounds.data.rounds.find((r) => r.status === 'open');
  const earlier = rounds.data.rounds.filter((r) => r !== open);
  return (
    <Panel title="Volunteer rounds" headingId="volunteer-rounds-heading">
      <div data-testid="volunteer-rounds">
        {open ? (
          <OpenRound key={open.id} round={open} policy={policy} bidLink={bidLink} flightId={flightId} timeZone={station.timeZone} role={role} flightLabel={flightLabel} arrival={arrival} />
        ) : (
          <OpenRoundForm flightId={flightId} policy={policy} role={role} volunteerTarget={forecast?.volunteerTarget ?? null} />
        )}
        {earlier.length > 0 && <EarlierRounds rounds={earlier} timeZone={station.timeZone} />}
      </div>
    </Panel>
  );
}

function EarlierRounds({ rounds, timeZone }: { rounds: Round[]; timeZone: string }) {
  return (
    <details className="mt-5 border-t-2 border-line pt-3">
      <summary className="cursor-pointer font-bold text-harbour">Earlier rounds on this flight ({rounds.length})</summary>
      <ul className="mt-2 space-y-1">
        {rounds.map((r) => (
          <li key={r.id} className="text-ink-soft">
            {r.kind === 'posted' ? 'Posted offer' : 'Sealed bids'} · opened {formatTime(r.openedAt, timeZone)} by {r.openedBy}
            {r.closedAt && ` · closed ${formatTime(r.closedAt, timeZone)}`} · {seatsFoundWords(r)}
          </li>
        ))}
      </ul>
    </details>
  );
}
