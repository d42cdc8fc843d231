import { describe, expect, it } from 'vitest';
import { agreementText } from './agreement-text';

describe('agreementText', () => {
  const base = { passengerName: 'Ada Quill', flight: 'ZZ 101', serviceDate: '2025-03-01', medium: 'travel-credit' as const, cashAmountMinor: 60_000, valueMinor: 75_000, currency: 'USD', expiresOn: null, restrictions: ['ZZ flights only'], ruleRef: '14 CFR 250.5(c)' };

  // 14 CFR 250.5(c): the passenger is told the cash amount and that they may decline the transportation benefit.
  it('tells the cash amount, the value, that money may be taken instead, and the expiry', () => {
    const text = agreementText(base);
    expect(text).toMatch(/USD\s600\.00/);
    expect(text).toMatch(/USD\s750\.00/);
    expect(text).toContain('refuse it and take the money');
    expect(text).toContain('does not expire');
    expect(agreementText({ ...base, expiresOn: '2026-03-01' })).toContain('until 2026-03-01');
  });
});
