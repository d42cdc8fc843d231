// The four payment mails (payout link, transfer receipt, card or voucher receipt, voucher offer) in every passenger
// language: the amount formatted the language's way, the booking's language on the page, no placeholder left
// unfilled, and what the station typed (voucher conditions, the rule's reference) kept exactly as given.
import { describe, expect, it } from 'vitest';
import { LANGUAGES, type Language } from '@shared/i18n';
import { compensationReceipt, voucherOffer } from '../payments/payment-notices';
import { payoutLinkNotice, transferReceipt } from './payout-notices';
import type { Notice } from '../../notices/notice';

const base = { passengerName: 'Ana Tester', flight: 'ZZ 6123', serviceDate: '2026-03-10', amountMinor: 40_000, currency: 'USD' };
const expiresAt = new Date('2026-03-13T18:00:00Z');
// CLDR currency patterns with the ISO code (from memory): English puts the code first with a decimal point; French,
// Spanish, German and Italian put it after the number with a decimal comma.
const AMOUNT: Record<Language, string> = { en: 'USD 400.00', fr: '400,00 USD', es: '400,00 USD', de: '400,00 USD', it: '400,00 USD' };
const spaces = (s: string) => s.replace(/[\u00a0\u202f]/g, ' ');

function expectWritten(notice: Notice, language: Language) {
  const label = `${language}: ${notice.subject}`;
  expect(spaces(notice.subject), label).toContain(AMOUNT[language]);
  expect(spaces(notice.text), label).toContain(AMOUNT[language]);
  expect(notice.text, label).toContain('Ana Tester');
  expect(`${notice.subject}${notice.text}`, label).not.toMatch(/[{}]/);
  expect(notice.html, label).toContain(`<html lang="${language}">`);
}

describe('the payment mails in every passenger language', () => {
  it('the payout link mail carries the link and the reference', () => {
    for (const language of LANGUAGES) {
      const notice = payoutLinkNotice({ ...base, url: 'https://app.example.test/payout/abc', expiresAt, compensationId: 41, language });
      expectWritten(notice, language);
      expect(notice.text).toContain('https://app.example.test/payout/abc');
      expect(notice.text).toContain('2026-03-13 18:00 UTC');
      expect(notice.text).toContain('C-41');
    }
  });

  it('the transfer receipt names the account ending', () => {
    for (const language of LANGUAGES) {
      const notice = transferReceipt({ ...base, accountEnding: '6789', compensationId: 41, language });
      expectWritten(notice, language);
      expect(notice.text).toContain('6789');
    }
  });

  it('the card and voucher receipts, with the voucher conditions kept as the station typed them', () => {
    for (const language of LANGUAGES) {
      const card = compensationReceipt({
        ...base, stationName: 'Roma Fiumicino', form: 'prepaid-card', last4: '4242', expiry: '03/2029', restrictions: [], compensationId: 41,
        details: { url: 'https://app.example.test/card/abc', expiresAt }, language,
      });
      expectWritten(card, language);
      expect(card.text).toContain('https://app.example.test/card/abc');
      expect(card.text).toContain('2026-03-13 18:00 UTC');
      const voucher = compensationReceipt({
        ...base, stationName: 'Roma Fiumicino', form: 'voucher', last4: null, expiry: null, restrictions: ['Air travel on our flights only'], compensationId: 41, details: null, language,
      });
      expectWritten(voucher, language);
      expect(voucher.text).toContain('Air travel on our flights only');
    }
  });

  it('the voucher offer keeps the conditions and the rule line as given', () => {
    for (const language of LANGUAGES) {
      const offer = voucherOffer({ ...base, restrictions: ['Valid 12 months'], rule: 'EU 261/2004 Art. 7(3)', language });
      expectWritten(offer, language);
      expect(offer.text).toContain('Valid 12 months');
      expect(offer.text).toContain('EU 261/2004 Art. 7(3)');
    }
  });

  it('is written in the booking language, and in English when it has none or an unknown one', () => {
    expect(transferReceipt({ ...base, accountEnding: null, compensationId: 41, language: 'fr' }).subject).toMatch(/^Votre indemnisation du vol ZZ 6123/);
    expect(voucherOffer({ ...base, restrictions: [], rule: 'x', language: 'de' }).text).toContain('Es wurden keine Bedingungen festgelegt.');
    for (const language of [null, undefined, 'xx']) {
      expect(transferReceipt({ ...base, accountEnding: null, compensationId: 41, language }).subject).toBe('Your compensation for flight ZZ 6123: USD\u00a0400.00 is on its way');
    }
  });
});
