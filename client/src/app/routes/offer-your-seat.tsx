import { useParams } from 'react-router-dom';
import { LanguageSwitch } from '../../features/offer-your-seat/components/language-switch';
import { OfferYourSeat } from '../../features/offer-your-seat/components/offer-your-seat';
import { useT } from '../../lib/language';
import { PassengerLanguage, usePassengerDocument } from '../passenger-language';

/**
 * The passenger's page, public and phone-first: no staff navigation, no sign-in, large type. The link's token is all
 * it knows; a new token is a new page, so nothing of one flight's link carries to another's. It speaks the language
 * the passenger picked, else the booking's (once known), else the browser's.
 */
export default function OfferYourSeatPage() {
  return (
    <PassengerLanguage>
      <PassengerFrame />
    </PassengerLanguage>
  );
}

function PassengerFrame() {
  const { token = '' } = useParams();
  const t = useT();
  const { language } = usePassengerDocument(t('passenger.title'));
  return (
    <div className="min-h-screen bg-paper text-ink" lang={language}>
      <header className="bg-harbour px-4 py-3 text-white">
        <div className="mx-auto flex max-w-xl flex-wrap items-center justify-between gap-x-4 gap-y-2">
          <p className="flex items-center gap-2 text-xl font-bold">
            <span aria-hidden className="inline-block h-5 w-5 rounded bg-signal" />
            {t('passenger.title')}
          </p>
          <LanguageSwitch />
        </div>
      </header>
      <main className="mx-auto max-w-xl px-4 py-5 text-xl">
        <OfferYourSeat key={token} token={token} />
      </main>
    </div>
  );
}
