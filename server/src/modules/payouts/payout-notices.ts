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
  /** The booking's language: the caution and the page's lang follow it (the body's words are English for now). */
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
  ], translatorFor(input.language));
}

/** A new card-details link the desk sent: the card's full details are on the page, never in the mail. */
export function cardLinkNotice(input: PayoutLinkInput): Notice {
  const amount = formatMoneyMinor('amount', { amountMinor: input.amountMinor, currency: input.currency });
  return renderNotice(`Your compensation card for flight ${input.flight}: a new link to see its details`, [
    { kind: 'paragraph', text: `Dear ${input.passengerName},` },
    { kind: 'paragraph', text: `Here is a new link to see the full details of your prepaid card of ${amount} for flight ${input.flight} on ${input.serviceDate}. Any earlier link no longer works.` },
    { kind: 'paragraph', text: `Please open it on your phone: ${input.url}` },
    { kind: 'paragraph', text: 'The link shows the card number and security code once, until the time below, after you confirm your booking reference and last name. We never send card numbers by e-mail.' },
    { kind: 'facts', rows: [['Amount', amount], ['Link valid until', `${input.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`], ['Reference', `C-${input.compensationId}`]] },
  ], translatorFor(input.language));
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
