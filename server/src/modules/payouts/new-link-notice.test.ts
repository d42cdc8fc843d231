// The desk's new-link mail, in each passenger language: the link, the safety words, the booking's language on the
// page, and never a placeholder left unfilled.
import { describe, expect, it } from 'vitest';
import { LANGUAGES } from '@shared/i18n';
import { newLinkNotice } from './payout-notices';

const input = {
  passengerName: 'Ana Tester', flight: 'ZZ 6123', serviceDate: '2026-03-10', amountMinor: 40_000, currency: 'USD',
  url: 'https://app.example.test/payout/abcDEF0123456789abcdef', expiresAt: new Date('2026-03-13T18:00:00Z'), compensationId: 41,
};

describe('the new-link mail', () => {
  it('is written in every passenger language, with the link and no unfilled placeholder', () => {
    for (const language of LANGUAGES) {
      for (const purpose of ['payout', 'card-details'] as const) {
        const notice = newLinkNotice({ ...input, language, purpose });
        expect(notice.text, `${language} ${purpose}`).toContain(input.url);
        expect(notice.text).toContain('C-41');
        expect(notice.text).not.toMatch(/[{}]/);
        expect(notice.html).toContain(`<html lang="${language}">`);
      }
    }
  });

  it('falls back to English for a booking without a known language', () => {
    expect(newLinkNotice({ ...input, language: 'xx', purpose: 'card-details' }).subject).toBe('A new link for your compensation for flight ZZ 6123');
  });
});
