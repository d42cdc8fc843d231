import { useParams } from 'react-router-dom';
import { CardDetailsView } from '../../features/payout/components/card-details-view';
import { PassengerFrame } from '../../features/payout/components/passenger-frame';
import { CARD_WORDS } from '../../features/payout/model/card-words';

/** The passenger's card-details page from the receipt's single-use link: public, phone-first, no sign-in. */
export default function CardDetailsPage() {
  const { token = '' } = useParams();
  return (
    <PassengerFrame title={CARD_WORDS.title} caution={CARD_WORDS.caution}>
      <CardDetailsView key={token} token={token} />
    </PassengerFrame>
  );
}
