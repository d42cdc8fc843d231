// The two e-mails of the payments module: the receipt once a card is issued, and a voucher offer, which states the
// cash amount and the voucher's restrictions before the passenger is asked to agree to anything. Both are written in
// the booking's language; the restrictions the station typed and the rule's reference stay as given.
import { renderNotice, type Block, type Notice } from '../../notices/notice';
import { translatorFor, utcMinute } from '../../notices/passenger-language';

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
  /** The booking's language (English when absent or unknown). */
  language?: string | null;
}

export function compensationReceipt(input: ReceiptInput): Notice {
  const tr = translatorFor(input.language);
  const amount = tr.money('amount', { amountMinor: input.amountMinor, currency: input.currency });
  const voucher = input.form === 'voucher';
  const trip = { flight: input.flight, date: input.serviceDate, station: input.stationName };
  const blocks: Block[] = [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names: input.passengerName }) },
    { kind: 'paragraph', text: tr.t(voucher ? 'notice.receipt.voucher' : 'notice.receipt.card', trip) },
    {
      kind: 'facts',
      rows: [
        [tr.t('notice.newLink.amount'), amount],
        [tr.t('notice.pay.paidAs'), tr.t(voucher ? 'notice.receipt.paidAsVoucher' : 'notice.receipt.paidAsCard')],
        ...(input.last4 ? [[tr.t('notice.receipt.cardEnding'), input.last4] as const] : []),
        ...(input.expiry ? [[tr.t('notice.receipt.validUntil'), input.expiry] as const] : []),
        [tr.t('notice.newLink.reference'), `C-${input.compensationId}`],
      ],
    },
  ];
  if (voucher && input.restrictions.length) blocks.push({ kind: 'list', title: tr.t('notice.voucher.conditions'), items: input.restrictions });
  if (input.details) {
    blocks.push(
      { kind: 'paragraph', text: tr.t('notice.receipt.detailsOpen', { url: input.details.url }) },
      { kind: 'paragraph', text: tr.t('notice.receipt.detailsSafety', { until: utcMinute(input.details.expiresAt) }) },
    );
  }
  return renderNotice(tr.t('notice.receipt.subject', { flight: input.flight, amount }), blocks, tr);
}

export interface VoucherOfferInput {
  passengerName: string;
  flight: string;
  serviceDate: string;
  amountMinor: number;
  currency: string;
  restrictions: readonly string[];
  rule: string;
  /** The booking's language (English when absent or unknown). */
  language?: string | null;
}

export function voucherOffer(input: VoucherOfferInput): Notice {
  const tr = translatorFor(input.language);
  const cash = tr.money('amount', { amountMinor: input.amountMinor, currency: input.currency });
  return renderNotice(tr.t('notice.voucherOffer.subject', { flight: input.flight, amount: cash }), [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names: input.passengerName }) },
    { kind: 'paragraph', text: tr.t('notice.voucherOffer.body', { flight: input.flight, date: input.serviceDate, amount: cash }) },
    { kind: 'facts', rows: [[tr.t('notice.voucherOffer.cash'), cash], [tr.t('notice.voucherOffer.value'), cash]] },
    { kind: 'list', title: tr.t('notice.voucher.conditions'), items: input.restrictions.length ? input.restrictions : [tr.t('notice.voucherOffer.noConditions')] },
    { kind: 'paragraph', text: input.rule },
  ], tr);
}
