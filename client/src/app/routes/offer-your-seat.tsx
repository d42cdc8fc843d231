import { useEffect } from 'react';
import { useParams } from 'react-router-dom';
import { setPageTitle } from '../../lib/document-title';
import { OfferYourSeat } from '../../features/offer-your-seat/components/offer-your-seat';

/**
 * The passenger's page, public and phone-first: no staff navigation, no sign-in, large type. The link's token is all
 * it knows; a new token is a new page, so nothing of one flight's link carries to another's.
 */
export default function OfferYourSeatPage() {
  const { token = '' } = useParams();
  useEffect(() => setPageTitle('Offer your seat'), []);
  return (
    <div className="min-h-screen bg-paper text-ink">
      <header className="bg-harbour px-4 py-3 text-white">
        <p className="mx-auto flex max-w-xl items-center gap-2 text-xl font-bold">
          <span aria-hidden className="inline-block h-5 w-5 rounded bg-signal" />
          Offer your seat
        </p>
      </header>
      <main className="mx-auto max-w-xl px-4 py-5 text-xl">
        <OfferYourSeat key={token} token={token} />
      </main>
    </div>
  );
}
