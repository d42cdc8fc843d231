import { describe, expect, it } from 'vitest';
import { COMPENSATION_STATES } from '@shared/schemas/finance';
import { STATE_LOOK, voucherStep } from './words';

const terms = { allowed: true, rule: 'r', cashAmountMinor: 100, currency: 'USD', restrictions: [], offeredAt: null, offerSentTo: null, agreedAt: null };

describe('compensation words', () => {
  it('says every state in words with an icon (never colour alone: WCAG 2.2 SC 1.4.1 Use of Color)', () => {
    for (const s of COMPENSATION_STATES) {
      expect(STATE_LOOK[s].text.length).toBeGreaterThan(0);
      expect(STATE_LOOK[s].icon.length).toBeGreaterThan(0);
    }
  });

  it('offers a voucher only for a due compensation whose regime allows it, and records agreement after the offer (14 CFR 250.5: a voucher replaces cash only when the passenger is told the cash amount and agrees, from memory)', () => {
    expect(voucherStep({ state: 'due', form: 'prepaid-card', voucher: terms })).toBe('offer');
    expect(voucherStep({ state: 'due', form: 'prepaid-card', voucher: { ...terms, offeredAt: '2026-01-01T00:00:00Z' } })).toBe('agree');
    expect(voucherStep({ state: 'due', form: 'voucher', voucher: { ...terms, agreedAt: '2026-01-01T00:00:00Z' } })).toBe('agreed');
    expect(voucherStep({ state: 'due', form: 'prepaid-card', voucher: { ...terms, allowed: false } })).toBe('none');
    expect(voucherStep({ state: 'issued', form: 'prepaid-card', voucher: terms })).toBe('none');
  });
});
