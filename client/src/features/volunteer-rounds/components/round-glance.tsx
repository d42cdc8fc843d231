import { useQuery } from '@tanstack/react-query';
import { formatMoney } from '../../../lib/format';
import { roundsQueryOptions } from '../api/rounds';
import { seatsFoundWords } from '../model/round-words';

/** The current round in one line for the desk's glance strip, with a way to jump to the round itself. */
export function RoundGlance({ flightId }: { flightId: number }) {
  const rounds = useQuery(roundsQueryOptions(flightId));
  if (!rounds.data) return <span className="text-base font-normal">{rounds.error ? 'Could not be loaded' : 'Loading…'}</span>;
  const open = rounds.data.rounds.find((r) => r.status === 'open');
  const jump = (
    <a href="#volunteer-rounds-heading" className="mt-1 inline-flex min-h-6 items-center text-base text-harbour underline" onClick={(e) => {
      // Move focus as well as the view, so the next Tab starts in the round.
      e.preventDefault();
      const heading = document.getElementById('volunteer-rounds-heading');
      heading?.scrollIntoView({ block: 'start' });
      heading?.focus({ preventScroll: true });
    }}>
      {open ? 'Go to the round' : 'Start a round'}
    </a>
  );
  if (!open) {
    return (
      <>
        <span className="block text-xl">No round open</span>
        {jump}
      </>
    );
  }
  return (
    <>
      <span className="block text-xl" data-testid="glance-round">{seatsFoundWords(open)}</span>
      <span className="block text-base font-normal">
        {open.kind === 'posted' && open.offerMinor !== null ? `Posted offer ${formatMoney(open.offerMinor, open.currency)}` : 'Sealed bids'}
      </span>
      {jump}
    </>
  );
}
