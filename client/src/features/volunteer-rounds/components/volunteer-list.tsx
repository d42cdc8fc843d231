import { useState } from 'react';
import type { Round, Volunteer } from '@shared/schemas/volunteers';
import { Button } from '../../../components/ui/button';
import { formatMoney, formatTime, formatTimeWithZone } from '../../../lib/format';
import { useDecideVolunteer } from '../api/rounds';
import { delayWords, seatsLeft } from '../model/round-words';
import { Problem } from './problem';
import { RebookPanel, type ArrivalClock } from './rebook-panel';

const STATUS_LOOK: Record<Volunteer['status'], { icon: string; word: string; tone: string }> = {
  offered: { icon: '◆', word: 'Offered', tone: 'border-watch bg-watch-soft text-watch' },
  accepted: { icon: '✓', word: 'Accepted', tone: 'border-calm bg-calm-soft text-calm' },
  declined: { icon: '✕', word: 'Declined', tone: 'border-line bg-paper text-ink-soft' },
  withdrawn: { icon: '✕', word: 'Withdrawn', tone: 'border-line bg-paper text-ink-soft' },
};

/** Everyone who offered a seat in this round; sealed asks arrive sorted lowest first. */
export function VolunteerList({ round, flightId, timeZone, arrival }: { round: Round; flightId: number; timeZone: string; arrival?: ArrivalClock }) {
  return (
    <section aria-labelledby={`volunteers-${round.id}`}>
      <h3 id={`volunteers-${round.id}`} className="mb-2 text-xl font-bold">
        Volunteers ({round.volunteers.length}){round.kind === 'sealed' && round.volunteers.length > 1 ? ' · lowest ask first' : ''}
      </h3>
      {round.volunteers.length === 0 ? (
        <p className="rounded-md border-2 border-dashed border-line px-4 py-3 text-lg text-ink-soft">
          Nobody has volunteered yet. Offers from the passenger link appear here by themselves.
        </p>
      ) : (
        <ul className="space-y-3" data-testid="volunteer-list">
          {round.volunteers.map((v) => (
            <VolunteerRow key={v.id} v={v} round={round} flightId={flightId} timeZone={timeZone} arrival={arrival} />
          ))}
        </ul>
      )}
    </section>
  );
}

function VolunteerRow({ v, round, flightId, timeZone, arrival }: { v: Volunteer; round: Round; flightId: number; timeZone: string; arrival?: ArrivalClock }) {
  const decide = useDecideVolunteer(flightId);
  const [rebooking, setRebooking] = useState(false);
  const look = STATUS_LOOK[v.status];
  const money = (m: number) => formatMoney(m, round.currency);
  const price = round.kind === 'sealed' ? v.askMinor : round.offerMinor;
  const seats = v.passengerIds.length;
  const fits = seats <= seatsLeft(round);
  return (
    <li className="rounded-lg border-2 border-line p-3" data-testid="volunteer-row" data-pnr={v.pnr}>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-xl font-bold">{v.names.join(', ')}</p>
          <p className="text-ink-soft">
            PNR <span className="font-bold text-ink">{v.pnr}</span> · {seats} {seats === 1 ? 'seat' : 'seats'} · {v.source === 'agent' ? 'at the counter' : 'from the passenger link'} · {formatTime(v.createdAt, timeZone)}
          </p>
          {round.kind === 'sealed' && v.askMinor !== null && <p className="text-lg">Asks <strong className="text-2xl tabular-nums">{money(v.askMinor)}</strong></p>}
        </div>
        <span className={`rounded-md border-2 px-2 py-1 font-bold ${look.tone}`}>
          <span aria-hidden>{look.icon} </span>
          {look.word}
        </span>
      </div>
      {v.status === 'offered' && v.pendingApproval && (
        <p role="status" className="mt-3 rounded-md border-l-4 border-watch bg-watch-soft px-3 py-2 text-lg font-bold" data-testid="volunteer-awaiting-approval">
          <span aria-hidden>◆ </span>Awaiting approval: a supervisor must approve accepting at {money(v.pendingApproval.offerMinor)} (asked by {v.pendingApproval.requestedBy} at{' '}
          {formatTime(v.pendingApproval.requestedAt, timeZone)}). The volunteer is accepted as soon as it is approved.
        </p>
      )}
      {v.status === 'offered' && !v.pendingApproval && (
        <div className="mt-3 flex flex-wrap items-center gap-2">
          <Button disabled={decide.isPending || !fits || (round.kind === 'posted' && round.offerMinor === null)} onClick={() => decide.mutate({ roundId: round.id, volunteerId: v.id, accept: true })}>
            Accept{price !== null ? ` at ${money(price)}` : ''}
            {seats > 1 ? ' a seat' : ''}
          </Button>
          <Button variant="secondary" disabled={decide.isPending} onClick={() => decide.mutate({ roundId: round.id, volunteerId: v.id, accept: false })}>
            Decline
          </Button>
          {!fits && <span className="font-bold text-watch">Only {seatsLeft(round)} seat(s) still needed: this party of {seats} does not fit.</span>}
        </div>
      )}
      {v.status === 'accepted' && (
        <div className="mt-3 space-y-2">
          {v.agreedMinor !== null && <p className="text-lg">Agreed <strong>{money(v.agreedMinor)}</strong> per seat.</p>}
          {v.rebooking ? (
            <p className="rounded-md border-l-4 border-calm bg-calm-soft px-3 py-2 text-lg" data-testid="rebooked">
              <strong>Rebooked on {v.rebooking.flight}</strong> · leaves {formatTime(v.rebooking.departure, timeZone)} · arrives {arrival ? formatTimeWithZone(v.rebooking.arrival, arrival.timeZone) : formatTime(v.rebooking.arrival, timeZone)} ·{' '}
              {v.rebooking.plannedArrivalDelayMinutes > 0 ? `${delayWords(v.rebooking.plannedArrivalDelayMinutes)} later than planned` : 'arrives on time'}
            </p>
          ) : rebooking ? (
            <RebookPanel volunteer={v} flightId={flightId} timeZone={timeZone} arrival={arrival} onDone={() => setRebooking(false)} />
          ) : (
            <Button onClick={() => setRebooking(true)}>Rebook</Button>
          )}
        </div>
      )}
      <Problem error={decide.error} />
    </li>
  );
}
