// The two e-mails of the payments module: the receipt once a card is issued, and a voucher offer, which states the
// cash amount and the voucher's restrictions before the passenger is asked to agree to anything.
import { formatMoneyMinor } from '../../notices/format';
import { renderNotice, type Block, type Notice } from '../../notices/notice';

export interface ReceiptInput {
  passengerName: string;
  flight: string;
  serviceDate: string;
  stationName: string;
  amountMinor: number;
  currency: string;
  form: 'prepaid-card' | 'voucher';
  last4: string | null;
  expiry: string | null;
  restrictions: readonly string[];
  compensationId: number;
  /** The single-use link to the card's full details; the mail itself never carries them. */
  details: { url: string; expiresAt: Date } | null;
}

export function compensationReceipt(input: ReceiptInput): Notice {
  const amount = formatMoneyMinor('amount', { amountMinor: input.amountMinor, currency: input.currency });
  const voucher = input.form === 'voucher';
  const blocks: Block[] = [
    { kind: 'paragraph', text: `Dear ${input.passengerName},` },
    {
      kind: 'paragraph',
      text: voucher
        ? `As you agreed, your compensation for flight ${input.flight} on ${input.serviceDate} from ${input.stationName} has been issued as a travel voucher.`
        : `Your compensation for flight ${input.flight} on ${input.serviceDate} from ${input.stationName} has been issued as a prepaid card. You can spend it like cash.`,
    },
    {
      kind: 'facts',
      rows: [
        ['Amount', amount],
        ['Paid as', voucher ? 'Travel voucher (virtual card limited to air travel)' : 'Prepaid virtual card (cash equivalent)'],
        ...(input.last4 ? [['Card ending', input.last4] as const] : []),
        ...(input.expiry ? [['Valid until', input.expiry] as const] : []),
        ['Reference', `C-${input.compensationId}`],
      ],
    },
  ];
  if (voucher && input.restrictions.length) blocks.push({ kind: 'list', title: 'Conditions of the voucher:', items: input.restrictions });
  if (input.details) {
    blocks.push(
      { kind: 'paragraph', text: `To see the full card number and security code, open this link on your phone: ${input.details.url}` },
      { kind: 'paragraph', text: `For your safety the link shows them once, until ${input.details.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC, after you confirm your booking reference and last name. Note them down or add the card to your phone's wallet when you see them. We never send card numbers by e-mail.` },
    );
  }
  return renderNotice(`Your compensation for flight ${input.flight}: ${amount}`, blocks);
}

export interface VoucherOfferInput {
  passengerName: string;
  flight: string;
  serviceDate: string;
  amountMinor: number;
  currency: string;
  restrictions: readonly string[];
  rule: string;
}

export function voucherOffer(input: VoucherOfferInput): Notice {
  const cash = formatMoneyMinor('amount', { amountMinor: input.amountMinor, currency: input.currency });
  return renderNotice(`Your compensation for flight ${input.flight}: ${cash} in money, or a travel voucher`, [
    { kind: 'paragraph', text: `Dear ${input.passengerName},` },
    {
      kind: 'paragraph',
      text: `For flight ${input.flight} on ${input.serviceDate} you are owed ${cash}. We pay it in money, on a prepaid card you can spend like cash. ` +
        `You may instead choose a travel voucher of the same value. You do not have to: if you say nothing, or refuse, you receive the money.`,
    },
    { kind: 'facts', rows: [['Cash amount', cash], ['Voucher value', cash]] },
    { kind: 'list', title: 'Conditions of the voucher:', items: input.restrictions.length ? input.restrictions : ['No conditions were set.'] },
    { kind: 'paragraph', text: input.rule },
  ]);
}
