import { useState } from 'react';
import type { ArrivalClock } from './rebook-panel';
import type { Round, VolunteerPolicy } from '@shared/schemas/volunteers';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/dialog';
import { useFocusIfLost } from '../../../components/ui/use-focus-if-lost';
import { formatMoney, formatTime } from '../../../lib/format';
import { useCloseRound } from '../api/rounds';
import { bidLinkToken, seatsFoundWords, seatsLeft } from '../model/round-words';
import { AddVolunteer } from './add-volunteer';
import { BidLinkQr } from './bid-link-qr';
import { Disclosure } from './disclosure';
import { OfferControl } from './offer-control';
import { Problem } from './problem';
import { VolunteerList } from './volunteer-list';

export interface OpenRoundProps {
  round: Round;
  policy: VolunteerPolicy;
  bidLink: string | null;
  flightId: number;
  timeZone: string;
  role: string | undefined;
  flightLabel?: string;
  arrival?: ArrivalClock;
}

/** A round in progress: how many seats are found, the offer, who volunteered, and what they must be told. */
export function OpenRound(props: OpenRoundProps) {
  const { round, policy, bidLink, flightId, timeZone } = props;
  const token = bidLink ? bidLinkToken(bidLink) : null;
  const done = seatsLeft(round) === 0;
  const offerText = round.kind === 'posted' && round.offerMinor !== null ? formatMoney(round.offerMinor, round.currency) : null;
  // Opening the round replaces its form: the progress line is where the agent continues.
  const progress = useFocusIfLost<HTMLParagraphElement>();
  return (
    <div className="grid gap-5 xl:grid-cols-[3fr_2fr]">
      <div className="space-y-5">
        <div className={`flex flex-wrap items-center justify-between gap-3 rounded-lg border-2 px-4 py-3 ${done ? 'border-calm bg-calm-soft' : 'border-ink bg-signal'}`}>
          <p ref={progress} tabIndex={-1} data-focus-target className="text-3xl font-bold" data-testid="round-progress">
            <span aria-hidden>{done ? '✓ ' : ''}</span>
            {seatsFoundWords(round)}
          </p>
          <p className="text-ink">
            {round.kind === 'posted' ? 'Posted offer' : 'Sealed bids'} · opened {formatTime(round.openedAt, timeZone)} by {round.openedBy}
          </p>
        </div>
        {done && (
          <p role="status" className="rounded-md border-l-4 border-calm bg-calm-soft px-3 py-2 text-lg font-bold">
            All the seats this round needs are found. Rebook the accepted volunteers, then close the round so no more offers come in.
          </p>
        )}
        <OfferControl round={round} policy={policy} role={props.role} flightId={flightId} timeZone={timeZone} />
        <VolunteerList round={round} flightId={flightId} timeZone={timeZone} arrival={props.arrival} />
        <AddVolunteer round={round} flightId={flightId} />
      </div>
      <aside className="space-y-4" aria-label="For the gate">
        {bidLink && <BidLinkQr link={bidLink} flightLabel={props.flightLabel} offerText={offerText} extras={round.extras} />}
        {token ? <Disclosure token={token} /> : <p className="text-ink-soft">No passenger link for this flight, so the disclosure cannot be shown.</p>}
        <CloseRound roundId={round.id} flightId={flightId} prominent={done} />
      </aside>
    </div>
  );
}

function CloseRound({ roundId, flightId, prominent }: { roundId: number; flightId: number; prominent: boolean }) {
  const [confirming, setConfirming] = useState(false);
  const close = useCloseRound(flightId);
  return (
    <>
      <Button variant={prominent ? 'primary' : 'secondary'} className="w-full" onClick={() => setConfirming(true)}>
        Close this round
      </Button>
      <ConfirmDialog
        open={confirming}
        onOpenChange={setConfirming}
        title="Close the round?"
        consequence="Passengers can no longer offer their seats; accepted volunteers stay accepted."
        confirmLabel="Yes, close the round"
        cancelLabel="Keep it open"
        danger
        pending={close.isPending}
        onConfirm={() => close.mutate(roundId, { onSuccess: () => setConfirming(false) })}
        problem={<Problem error={close.error} />}
        // The round's panel is redrawn without this button: its outcome heading is the next thing to read.
        returnFocus={() => document.getElementById('volunteer-rounds-heading')}
      />
    </>
  );
}
