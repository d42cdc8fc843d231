// Every word the bank-transfer page shows the passenger, from the shared catalogues in the passenger's language,
// in one place so the page reads as a whole.
import { translator } from '@shared/i18n';
import { linkPageWords, type T } from './link-words';

export function payoutWords(t: T) {
  return {
    title: t('payout.title'),
    loading: t('passenger.loading'),
    intro: (amount: string, flight: string) => t('payout.intro', { amount, flight }),
    privacy: t('payout.privacy'),
    proofTitle: t('paylink.proofTitle'),
    proofHint: t('passenger.identify.where'),
    pnr: t('passenger.identify.pnr'),
    lastName: t('passenger.identify.lastName'),
    accountTitle: t('payout.accountTitle'),
    holderName: t('payout.holderName'),
    routingNumber: t('payout.routingNumber'),
    accountNumber: t('payout.accountNumber'),
    accountNumberAgain: t('payout.accountNumberAgain'),
    accountType: t('payout.accountType'),
    checking: t('payout.checking'),
    savings: t('payout.savings'),
    fixBelow: t('payout.fixBelow'),
    send: t('payout.send'),
    sending: t('payout.sending'),
    doneTitle: t('passenger.outcome.thanks'),
    done: (ending: string) => t('payout.done', { ending }),
    already: (ending: string | null) => t('payout.already', { ending: ending ?? 'none' }),
    ...linkPageWords(t, t('payout.usedText')),
  };
}

/** English, for the request layer's fallback messages (the page shows its own words for every known error). */
export const PAYOUT_WORDS = payoutWords(translator('en').t);
