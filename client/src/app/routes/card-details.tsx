import { useParams } from 'react-router-dom';
import { CardDetailsView } from '../../features/payout/components/card-details-view';
import { PassengerFrame } from '../../features/payout/components/passenger-frame';
import { cardWords } from '../../features/payout/model/card-words';
import { useT } from '../../lib/language';
import { PassengerLanguage, usePassengerDocument } from '../passenger-language';

/** The passenger's card-details page from the receipt's single-use link: public, phone-first, no sign-in. */
export default function CardDetailsPage() {
  return (
    <PassengerLanguage>
      <CardDetails />
    </PassengerLanguage>
  );
}

function CardDetails() {
  const { token = '' } = useParams();
  const W = cardWords(useT());
  const { language, switcher } = usePassengerDocument(W.title);
  return (
    <PassengerFrame title={W.title} caution={W.caution} language={language} switcher={switcher}>
      <CardDetailsView key={token} token={token} />
    </PassengerFrame>
  );
}
