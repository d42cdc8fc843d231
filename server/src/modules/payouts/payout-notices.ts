// The passenger's mails of a bank transfer: the link to give their account (never asking for it by mail), and the
// receipt once the transfer has left. Neither carries an account or card number; the receipt names the last four.
// All are written in the booking's language from the shared catalogues.
import { renderNotice, type Notice } from '../../notices/notice';
import { translatorFor, utcMinute } from '../../notices/passenger-language';

export interface PayoutLinkInput {
  passengerName: string;
  flight: string;
  serviceDate: string;
  amountMinor: number;
  currency: string;
  url: string;
  expiresAt: Date;
  compensationId: number;
  /** The booking's language (the mail is written in it; English when absent or unknown). */
  language?: string | null;
}

export function payoutLinkNotice(input: PayoutLinkInput): Notice {
  const tr = translatorFor(input.language);
  const amount = tr.money('amount', { amountMinor: input.amountMinor, currency: input.currency });
  return renderNotice(tr.t('notice.payoutLink.subject', { flight: input.flight, amount }), [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names: input.passengerName }) },
    { kind: 'paragraph', text: tr.t('notice.payoutLink.intro', { amount, flight: input.flight, date: input.serviceDate }) },
    { kind: 'paragraph', text: tr.t('notice.payoutLink.open', { url: input.url }) },
    { kind: 'paragraph', text: tr.t('notice.newLink.payoutSafety') },
    {
      kind: 'facts',
      rows: [[tr.t('notice.newLink.amount'), amount], [tr.t('notice.newLink.validUntil'), utcMinute(input.expiresAt)], [tr.t('notice.newLink.reference'), `C-${input.compensationId}`]],
    },
  ], tr);
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
      rows: [[tr.t('notice.newLink.amount'), amount], [tr.t('notice.newLink.validUntil'), utcMinute(input.expiresAt)], [tr.t('notice.newLink.reference'), `C-${input.compensationId}`]],
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
  /** The booking's language (English when absent or unknown). */
  language?: string | null;
}

export function transferReceipt(input: TransferReceiptInput): Notice {
  const tr = translatorFor(input.language);
  const amount = tr.money('amount', { amountMinor: input.amountMinor, currency: input.currency });
  return renderNotice(tr.t('notice.transfer.subject', { flight: input.flight, amount }), [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names: input.passengerName }) },
    { kind: 'paragraph', text: tr.t('notice.transfer.body', { flight: input.flight, date: input.serviceDate }) },
    {
      kind: 'facts',
      rows: [
        [tr.t('notice.newLink.amount'), amount],
        [tr.t('notice.pay.paidAs'), tr.t('notice.transfer.bankTransfer')],
        ...(input.accountEnding ? [[tr.t('notice.transfer.accountEnding'), input.accountEnding] as const] : []),
        [tr.t('notice.newLink.reference'), `C-${input.compensationId}`],
      ],
    },
  ], tr);
}
