// The passenger's mails of a bank transfer: the link to give their account (never asking for it by mail), and the
// receipt once the transfer has left. Neither carries an account or card number; the receipt names the last four.
import { formatMoneyMinor } from '../../notices/format';
import { translator, isLanguage } from '@shared/i18n';
import { renderNotice, type Notice } from '../../notices/notice';

export interface PayoutLinkInput {
  passengerName: string;
  flight: string;
  serviceDate: string;
  amountMinor: number;
  currency: string;
  url: string;
  expiresAt: Date;
  compensationId: number;
  /** The booking's language (a new link's mail is written in it; English when absent or unknown). */
  language?: string | null;
}

const translatorFor = (language: string | null | undefined) => translator(isLanguage(language) ? language : 'en');

export function payoutLinkNotice(input: PayoutLinkInput): Notice {
  const amount = formatMoneyMinor('amount', { amountMinor: input.amountMinor, currency: input.currency });
  return renderNotice(`Your compensation for flight ${input.flight}: tell us where to send ${amount}`, [
    { kind: 'paragraph', text: `Dear ${input.passengerName},` },
    { kind: 'paragraph', text: `Your compensation of ${amount} for flight ${input.flight} on ${input.serviceDate} will be paid by bank transfer to your own account.` },
    { kind: 'paragraph', text: `Please open this link on your phone and enter your bank account there: ${input.url}` },
    { kind: 'paragraph', text: 'The link works once, until the time below. We will never ask for your bank details by e-mail or telephone, and staff never type them for you.' },
    { kind: 'facts', rows: [['Amount', amount], ['Link valid until', `${input.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`], ['Reference', `C-${input.compensationId}`]] },
  ]);
}

/**
 * The new link the desk sent, payout or card details, all in the booking's language: what it is for, that older
 * links stopped working, and the same safety words as the first mail. Never a card or account number.
 */
export function newLinkNotice(input: PayoutLinkInput & { purpose: 'payout' | 'card-details' }): Notice {
  const tr = translatorFor(input.language);
  const amount = tr.money('amount', { amountMinor: input.amountMinor, currency: input.currency });
  const card = input.purpose === 'card-details';
  return renderNotice(tr.t('notice.newLink.subject', { flight: input.flight }), [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names: input.passengerName }) },
    { kind: 'paragraph', text: tr.t(card ? 'notice.newLink.card' : 'notice.newLink.payout', { amount, flight: input.flight, date: input.serviceDate }) },
    { kind: 'paragraph', text: tr.t('notice.newLink.open', { url: input.url }) },
    { kind: 'paragraph', text: tr.t(card ? 'notice.newLink.cardSafety' : 'notice.newLink.payoutSafety') },
    {
      kind: 'facts',
      rows: [[tr.t('notice.newLink.amount'), amount], [tr.t('notice.newLink.validUntil'), `${input.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`], [tr.t('notice.newLink.reference'), `C-${input.compensationId}`]],
    },
  ], tr);
}

export interface TransferReceiptInput {
  passengerName: string;
  flight: string;
  serviceDate: string;
  amountMinor: number;
  currency: string;
  accountEnding: string | null;
  compensationId: number;
}

export function transferReceipt(input: TransferReceiptInput): Notice {
  const amount = formatMoneyMinor('amount', { amountMinor: input.amountMinor, currency: input.currency });
  return renderNotice(`Your compensation for flight ${input.flight}: ${amount} is on its way`, [
    { kind: 'paragraph', text: `Dear ${input.passengerName},` },
    { kind: 'paragraph', text: `We have sent your compensation for flight ${input.flight} on ${input.serviceDate} by bank transfer. Banks usually credit it within a few working days.` },
    {
      kind: 'facts',
      rows: [['Amount', amount], ['Paid as', 'Bank transfer'], ...(input.accountEnding ? [['To the account ending', input.accountEnding] as const] : []), ['Reference', `C-${input.compensationId}`]],
    },
  ]);
}
