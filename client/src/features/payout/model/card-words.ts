// Every word the card-details page shows the passenger, from the shared catalogues in the passenger's language,
// in one place so the page reads as a whole.
import { translator } from '@shared/i18n';
import { linkPageWords, type T } from './link-words';

export function cardWords(t: T) {
  return {
    title: t('card.title'),
    loading: t('passenger.loading'),
    intro: (amount: string, flight: string) => t('card.intro', { amount, flight }),
    onceWarning: t('card.onceWarning'),
    proofTitle: t('paylink.proofTitle'),
    proofHint: t('passenger.identify.where'),
    pnr: t('passenger.identify.pnr'),
    lastName: t('passenger.identify.lastName'),
    fillBoth: t('passenger.identify.fillBoth'),
    pnrShape: t('passenger.identify.format'),
    show: t('card.show'),
    showing: t('card.showing'),
    detailsTitle: t('card.detailsTitle'),
    number: t('card.number'),
    expiry: t('card.expiry'),
    cvc: t('card.cvc'),
    amount: t('card.amount'),
    afterShown: t('card.afterShown'),
    ...linkPageWords(t, t('card.usedText')),
  };
}

/** English, for the request layer's fallback messages (the page shows its own words for every known error). */
export const CARD_WORDS = cardWords(translator('en').t);
