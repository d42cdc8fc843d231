import { describe, expect, it } from 'vitest';
import { missingForAlternative, paymentTerms } from './index';

describe('paymentTerms: media and deadlines by rule', () => {
  it('US: cash or cheque by the end of the day of the denial, credit only with agreement (14 CFR 250.8(a), 250.5(c))', () => {
    const terms = paymentTerms({ regime: 'us-dot', deniedAt: '2025-03-01T07:42:00-05:00' });
    expect(terms.media).toEqual(['cash', 'cheque', 'prepaid-card', 'travel-credit']);
    expect(terms.needsAgreement).toEqual(['prepaid-card', 'travel-credit']);
    // "on the day and place the denied boarding occurs": 1 Mar 23:59:59.999 at UTC-5.
    expect(terms.dueBy).toBe('2025-03-02T04:59:59.999Z');
    expect(terms.ruleRef).toContain('250.8(a)');
  });

  it('US: the alternate leaving later the same day moves the deadline to its departure', () => {
    const terms = paymentTerms({ regime: 'us-dot', deniedAt: '2025-03-01T07:42:00-05:00', alternateDepartsAt: '2025-03-01T11:00:00-05:00' });
    expect(terms.dueBy).toBe('2025-03-01T16:00:00.000Z');
    expect(terms.media[0]).toBe('cash');
  });

  it('US: the alternate leaving before payment can be prepared: sent within 24 h (14 CFR 250.8(b))', () => {
    const terms = paymentTerms({ regime: 'us-dot', deniedAt: '2025-03-01T12:00:00Z', alternateDepartsAt: '2025-03-01T12:10:00Z' });
    expect(terms.dueBy).toBe('2025-03-02T12:00:00.000Z');
    expect(terms.media[0]).toBe('cheque');
    expect(terms.media).not.toContain('cash');
    expect(terms.ruleRef).toContain('250.8(b)');
  });

  it('EU and UK: cash, transfer or cheque; card and voucher need the signed agreement; no period in hours (Art. 7(3), 4(3))', () => {
    for (const regime of ['eu-261', 'uk-261'] as const) {
      const terms = paymentTerms({ regime, deniedAt: '2025-03-01T12:00:00+01:00' });
      expect(terms.media.slice(0, 3)).toEqual(['cash', 'bank-transfer', 'cheque']);
      expect(terms.needsAgreement).toEqual(['prepaid-card', 'travel-credit']);
      expect(terms.dueBy).toBeNull();
      expect(terms.ruleRef).toContain('Art. 7(3)');
    }
  });

  it('Canada: money within 48 h of the denial (SOR/2019-150 s. 20; the regulator\'s guide)', () => {
    const terms = paymentTerms({ regime: 'ca-appr', deniedAt: '2025-03-01T07:00:00-05:00' });
    expect(terms.dueBy).toBe('2025-03-03T12:00:00.000Z');
    expect(terms.media[0]).toBe('cash');
    expect(terms.needsAgreement).toEqual(['prepaid-card', 'travel-credit']);
  });

  it('volunteers: no regulated deadline; the card they accepted in the round, a credit only with a new agreement', () => {
    const terms = paymentTerms({ regime: 'ca-appr', deniedAt: '2025-03-01T07:00:00Z', voluntary: true });
    expect(terms.dueBy).toBeNull();
    expect(terms.media[0]).toBe('prepaid-card');
    expect(terms.needsAgreement).toEqual(['travel-credit']);
  });

  it('bad input is a RangeError naming the field', () => {
    expect(() => paymentTerms({ regime: 'xx' as never, deniedAt: '2025-03-01T07:00:00Z' })).toThrow(/^regime:/);
    expect(() => paymentTerms({ regime: 'us-dot', deniedAt: '2025-03-01' })).toThrow(/^deniedAt:/);
    expect(() => paymentTerms({ regime: 'us-dot', deniedAt: '2025-03-01T07:00:00Z', voluntary: 'yes' as never })).toThrow(/^voluntary:/);
    expect(() => paymentTerms({ regime: 'us-dot', deniedAt: '2025-03-01T07:00:00Z', alternateDepartsAt: '2025-03-01T06:00:00Z' })).toThrow(/^alternateDepartsAt:/);
  });
});

describe('missingForAlternative: a card or credit only on the rule\'s conditions', () => {
  const base = { regime: 'us-dot' as const, medium: 'travel-credit' as const, cashAmountMinor: 60_000, valueMinor: 60_000, toldInWriting: true, accepted: true, expiresAt: null };

  it('US: a credit worth the cash amount, told and accepted, may be issued (14 CFR 250.5(c))', () => {
    expect(missingForAlternative(base)).toEqual([]);
  });

  it('US: worth less than the cash, or not accepted, is refused', () => {
    expect(missingForAlternative({ ...base, valueMinor: 59_999 })).toHaveLength(1);
    expect(missingForAlternative({ ...base, accepted: false, toldInWriting: false })).toHaveLength(2);
  });

  it('Canada: must be worth more than the money and never expire (SOR/2019-150, from memory)', () => {
    const ca = { ...base, regime: 'ca-appr' as const, cashAmountMinor: 90_000, valueMinor: 90_000 };
    expect(missingForAlternative(ca).join(' ')).toContain('greater than');
    expect(missingForAlternative({ ...ca, valueMinor: 100_000 })).toEqual([]);
    expect(missingForAlternative({ ...ca, valueMinor: 100_000, expiresAt: '2026-03-01' }).join(' ')).toContain('must not expire');
  });

  it('cash needs nothing; bad input names the field', () => {
    expect(missingForAlternative({ ...base, medium: 'cash', accepted: false })).toEqual([]);
    expect(() => missingForAlternative({ ...base, valueMinor: -1 })).toThrow(/^valueMinor:/);
    expect(() => missingForAlternative({ ...base, medium: 'gold' as never })).toThrow(/^medium:/);
  });
});
