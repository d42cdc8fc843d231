import { describe, expect, it } from 'vitest';
import { paymentStep } from './payment-step';

const terms = { media: ['cash', 'cheque', 'prepaid-card', 'travel-credit'], needsAgreement: ['prepaid-card', 'travel-credit'], dueBy: null, dueStatus: null, ruleRef: 'r', conditions: { value: 'at-least', writtenInformation: true, noExpiry: false, ruleRef: 'r' }, restrictions: [] as string[], timeZone: 'UTC' } as const;
const base = { state: 'due' as const, medium: 'cash' as const, payment: { terms: { ...terms, media: [...terms.media], needsAgreement: [...terms.needsAgreement] }, agreement: null, counterPayment: null } };

describe('paymentStep', () => {
  it('cash or cheque: paid at the counter; a card or credit: agreement first, then issue', () => {
    expect(paymentStep(base)).toBe('counter');
    expect(paymentStep({ ...base, medium: 'travel-credit' })).toBe('agree');
    const agreement = { medium: 'travel-credit' as const, method: 'desk-signature' as const, text: 't', cashAmountMinor: 1, valueMinor: 1, currency: 'USD', expiresOn: null, acceptedAt: 'x', staffUserId: 1, signed: true };
    expect(paymentStep({ ...base, medium: 'travel-credit', payment: { ...base.payment, agreement } })).toBe('issue');
    // An agreement to another medium does not count.
    expect(paymentStep({ ...base, medium: 'prepaid-card', payment: { ...base.payment, agreement } })).toBe('agree');
    expect(paymentStep({ ...base, state: 'issued', medium: 'prepaid-card' })).toBe('none');
  });
});
