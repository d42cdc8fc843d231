import { useParams } from 'react-router-dom';
import { PassengerFrame } from '../../features/payout/components/passenger-frame';
import { PayoutView } from '../../features/payout/components/payout-view';
import { payoutWords } from '../../features/payout/model/payout-words';
import { useT } from '../../lib/language';
import { PassengerLanguage, usePassengerDocument } from '../passenger-language';

/** The passenger's bank-transfer page from the mailed single-use link: public, phone-first, no sign-in. */
export default function PayoutPage() {
  return (
    <PassengerLanguage>
      <Payout />
    </PassengerLanguage>
  );
}

function Payout() {
  const { token = '' } = useParams();
  const W = payoutWords(useT());
  const { language, switcher } = usePassengerDocument(W.title);
  return (
    <PassengerFrame title={W.title} caution={W.caution} language={language} switcher={switcher}>
      <PayoutView key={token} token={token} />
    </PassengerFrame>
  );
}
