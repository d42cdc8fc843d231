import { useParams } from 'react-router-dom';
import { PassengerFrame } from '../../features/payout/components/passenger-frame';
import { PayoutView } from '../../features/payout/components/payout-view';
import { PAYOUT_WORDS } from '../../features/payout/model/payout-words';

/** The passenger's bank-transfer page from the mailed single-use link: public, phone-first, no sign-in. */
export default function PayoutPage() {
  const { token = '' } = useParams();
  return (
    <PassengerFrame title={PAYOUT_WORDS.title} caution={PAYOUT_WORDS.caution}>
      <PayoutView key={token} token={token} />
    </PassengerFrame>
  );
}
