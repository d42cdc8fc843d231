// The four payment mails read, in English, word for word as they did before they moved into the catalogues: the
// move changes the language they can be written in, never what an English-speaking passenger receives.
import { describe, expect, it } from 'vitest';
import { compensationReceipt, voucherOffer } from '../payments/payment-notices';
import { payoutLinkNotice, transferReceipt } from './payout-notices';

const base = { passengerName: 'Ana Tester', flight: 'ZZ 6123', serviceDate: '2026-03-10', amountMinor: 40_000, currency: 'USD' };
const expiresAt = new Date('2026-03-13T18:00:00Z');

describe('the payment mails in English', () => {
  it('the payout link mail is unchanged', () => {
    const notice = payoutLinkNotice({ ...base, url: 'https://app.example.test/payout/abc', expiresAt, compensationId: 41 });
    expect(`${notice.subject}\n${notice.text}`).toMatchInlineSnapshot(`
      "Your compensation for flight ZZ 6123: tell us where to send USD\u00a0400.00
      Dear Ana Tester,

      Your compensation of USD\u00a0400.00 for flight ZZ 6123 on 2026-03-10 will be paid by bank transfer to your own account.

      Please open this link on your phone and enter your bank account there: https://app.example.test/payout/abc

      The link works once, until the time below. We will never ask for your bank details by e-mail or telephone, and staff never type them for you.

      Amount:           USD\u00a0400.00
      Link valid until: 2026-03-13 18:00 UTC
      Reference:        C-41

      Please note: Amounts in this message were computed from the rules configured for this station and the applicable passenger-rights regulation. The regulation, the contract of carriage and the carrier's compliance staff decide what is owed; if anything here differs from them, they prevail.
      "
    `);
  });

  it('the transfer receipt is unchanged, with and without the account ending', () => {
    const notice = transferReceipt({ ...base, accountEnding: '6789', compensationId: 41 });
    expect(`${notice.subject}\n${notice.text}`).toMatchInlineSnapshot(`
      "Your compensation for flight ZZ 6123: USD\u00a0400.00 is on its way
      Dear Ana Tester,

      We have sent your compensation for flight ZZ 6123 on 2026-03-10 by bank transfer. Banks usually credit it within a few working days.

      Amount:                USD\u00a0400.00
      Paid as:               Bank transfer
      To the account ending: 6789
      Reference:             C-41

      Please note: Amounts in this message were computed from the rules configured for this station and the applicable passenger-rights regulation. The regulation, the contract of carriage and the carrier's compliance staff decide what is owed; if anything here differs from them, they prevail.
      "
    `);
    expect(transferReceipt({ ...base, accountEnding: null, compensationId: 41 }).text).not.toContain('account ending');
  });

  it('the compensation receipt is unchanged for a card and for a voucher', () => {
    const card = compensationReceipt({
      ...base, stationName: 'Denver', form: 'prepaid-card', last4: '4242', expiry: '03/2029', restrictions: [], compensationId: 41,
      details: { url: 'https://app.example.test/card/abc', expiresAt },
    });
    expect(`${card.subject}\n${card.text}`).toMatchInlineSnapshot(`
      "Your compensation for flight ZZ 6123: USD\u00a0400.00
      Dear Ana Tester,

      Your compensation for flight ZZ 6123 on 2026-03-10 from Denver has been issued as a prepaid card. You can spend it like cash.

      Amount:      USD\u00a0400.00
      Paid as:     Prepaid virtual card (cash equivalent)
      Card ending: 4242
      Valid until: 03/2029
      Reference:   C-41

      To see the full card number and security code, open this link on your phone: https://app.example.test/card/abc

      For your safety the link shows them once, until 2026-03-13 18:00 UTC, after you confirm your booking reference and last name. Note them down or add the card to your phone's wallet when you see them. We never send card numbers by e-mail.

      Please note: Amounts in this message were computed from the rules configured for this station and the applicable passenger-rights regulation. The regulation, the contract of carriage and the carrier's compliance staff decide what is owed; if anything here differs from them, they prevail.
      "
    `);
    const voucher = compensationReceipt({
      ...base, stationName: 'Denver', form: 'voucher', last4: null, expiry: null, restrictions: ['Air travel on our flights only'], compensationId: 41, details: null,
    });
    expect(`${voucher.subject}\n${voucher.text}`).toMatchInlineSnapshot(`
      "Your compensation for flight ZZ 6123: USD\u00a0400.00
      Dear Ana Tester,

      As you agreed, your compensation for flight ZZ 6123 on 2026-03-10 from Denver has been issued as a travel voucher.

      Amount:    USD\u00a0400.00
      Paid as:   Travel voucher (virtual card limited to air travel)
      Reference: C-41

      Conditions of the voucher:
      - Air travel on our flights only

      Please note: Amounts in this message were computed from the rules configured for this station and the applicable passenger-rights regulation. The regulation, the contract of carriage and the carrier's compliance staff decide what is owed; if anything here differs from them, they prevail.
      "
    `);
  });

  it('the voucher offer is unchanged, with and without conditions', () => {
    const offer = voucherOffer({ ...base, restrictions: ['Valid 12 months'], rule: 'US 14 CFR 250.5(c)' });
    expect(`${offer.subject}\n${offer.text}`).toMatchInlineSnapshot(`
      "Your compensation for flight ZZ 6123: USD\u00a0400.00 in money, or a travel voucher
      Dear Ana Tester,

      For flight ZZ 6123 on 2026-03-10 you are owed USD\u00a0400.00. We pay it in money, on a prepaid card you can spend like cash. You may instead choose a travel voucher of the same value. You do not have to: if you say nothing, or refuse, you receive the money.

      Cash amount:   USD\u00a0400.00
      Voucher value: USD\u00a0400.00

      Conditions of the voucher:
      - Valid 12 months

      US 14 CFR 250.5(c)

      Please note: Amounts in this message were computed from the rules configured for this station and the applicable passenger-rights regulation. The regulation, the contract of carriage and the carrier's compliance staff decide what is owed; if anything here differs from them, they prevail.
      "
    `);
    expect(voucherOffer({ ...base, restrictions: [], rule: 'x' }).text).toContain('No conditions were set.');
  });
});
