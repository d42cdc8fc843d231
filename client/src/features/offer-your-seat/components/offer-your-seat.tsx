import { useEffect, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { OfferRequestError, passengerStatusQueryOptions, publicOfferQueryOptions } from '../api/public-offer';
import { forgetPassenger, recallPassenger, rememberPassenger, type Identified } from '../model/passenger-session';
import { BeforeYouDecide } from './before-you-decide';
import { IdentifyForm } from './identify-form';
import { LinkInvalid } from './link-invalid';
import { MakeOffer } from './make-offer';
import { OfferSummary } from './offer-summary';
import { Outcome } from './outcome';
import { useLanguage, useT } from '../../../lib/language';

const isLinkInvalid = (err: unknown) => err instanceof OfferRequestError && err.linkInvalid;

/** "Offer your seat": the passenger's page behind the gate's QR code, from the offer to the outcome. */
export function OfferYourSeat({ token }: { token: string }) {
  const offer = useQuery(publicOfferQueryOptions(token));
  const t = useT();
  const { suggest } = useLanguage();
  const AGAIN = t('passenger.findAgain');
  const [who, setWho] = useState<Identified | null>(() => recallPassenger(token));
  const [notice, setNotice] = useState<string | undefined>();
  const [brokenByAction, setBrokenByAction] = useState(false);
  const status = useQuery({ ...passengerStatusQueryOptions(token, who?.passengerToken ?? ''), enabled: who !== null });

  // A booking token the server no longer takes (expired with the link, or from another flight): ask again.
  const sessionLost = status.error instanceof OfferRequestError && status.error.status === 401;
  const identified = who && !sessionLost ? who : null;
  const invalid = brokenByAction || isLinkInvalid(offer.error) || isLinkInvalid(status.error);
  useEffect(() => {
    if (invalid) forgetPassenger(token);
  }, [invalid, token]);

  if (invalid) return <LinkInvalid />;
  if (offer.isPending) return <p className="text-2xl text-ink-soft">{t('passenger.loading')}</p>;
  if (offer.error) {
    return (
      <div role="alert" className="rounded-xl border-4 border-alert bg-card p-6">
        <h1 className="text-3xl font-bold text-alert">{t('passenger.loadFailed')}</h1>
        <p className="mt-3 text-xl">{offer.error.message}</p>
        <button type="button" className="mt-4 text-xl font-bold text-harbour underline" onClick={() => void offer.refetch()}>
          {t('passenger.tryAgain')}
        </button>
      </div>
    );
  }

  const data = offer.data;
  const identifyNotice = notice ?? (sessionLost ? AGAIN : undefined);
  let step;
  if (!identified) {
    step = (
      <>
        <BeforeYouDecide disclosure={data.disclosure} />
        {data.round && (
          <IdentifyForm
            token={token} notice={identifyNotice} onLinkInvalid={() => setBrokenByAction(true)}
            onIdentified={(w) => {
              rememberPassenger(token, w);
              // The booking's language, unless the passenger already picked one on this page.
              if (w.language) suggest(w.language);
              setNotice(undefined);
              setWho(w);
            }}
          />
        )}
      </>
    );
  } else if (status.isPending) {
    step = <p className="text-2xl text-ink-soft">{t('passenger.checking')}</p>;
  } else if (!status.data) {
    step = <p role="alert" className="text-xl font-bold text-alert">{status.error?.message} {t('passenger.retrying')}</p>;
  } else if (status.data.status !== 'none') {
    step = <Outcome status={status.data} timeZone={data.flight.timeZone} />;
  } else if (!data.round) {
    step = <p className="text-xl">{t('passenger.notOffered')}</p>;
  } else {
    step = (
      <>
        <BeforeYouDecide disclosure={data.disclosure} />
        <MakeOffer
          token={token} round={data.round} who={identified} onLinkInvalid={() => setBrokenByAction(true)}
          onSessionLost={() => {
            forgetPassenger(token);
            setWho(null);
            setNotice(AGAIN);
          }}
        />
      </>
    );
  }
  return (
    <div className="space-y-5">
      <OfferSummary offer={data} offerSent={Boolean(identified && status.data && status.data.status !== 'none')} />
      {step}
    </div>
  );
}
