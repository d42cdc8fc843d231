import type { PassengerLinkView } from '@shared/schemas/payment-media';
import { Button } from '../../../components/ui/button';
import { formatTimeWithZone } from '../../../lib/format';
import { useSendNewLink } from '../api/compensations';
import { Problem } from './problem';

const WHAT: Record<PassengerLinkView['purpose'], string> = { payout: 'payout link (for their bank account)', 'card-details': 'card-details link' };
const STATE_WORDS: Record<PassengerLinkView['state'], string> = {
  ready: 'works until',
  expired: 'expired at',
  locked: 'is locked after wrong booking details; it would have worked until',
  used: 'has done its job (used once)',
};

/**
 * The passenger lost their link, or it expired or locked: the desk mails a new one and the old one stops working.
 * Offered only while the link's job is not done; a card shown or an account given is never opened again.
 */
export function NewLinkButton({ flightId, compensationId, link, timeZone }: { flightId: number; compensationId: number; link: PassengerLinkView; timeZone: string }) {
  const send = useSendNewLink(flightId);
  const sentUntil = send.data?.link.expiresAt;
  return (
    <div className="mt-4" data-testid="passenger-link">
      <p className="text-lg">
        The passenger’s {WHAT[link.purpose]} {STATE_WORDS[link.state]}
        {link.state !== 'used' && ` ${formatTimeWithZone(link.expiresAt, timeZone)}`}.
      </p>
      {link.replaceable && (
        <Button onClick={() => send.mutate(compensationId)} disabled={send.isPending} className="mt-2 text-lg">
          {send.isPending ? 'Sending…' : 'Mail the passenger a new link'}
        </Button>
      )}
      {sentUntil && !send.isPending && (
        <p role="status" className="mt-2 font-bold">
          A new link was mailed; it works until {formatTimeWithZone(sentUntil, timeZone)}. The old one no longer works.
        </p>
      )}
      <Problem error={send.error} />
    </div>
  );
}
