import type { DeskCompensation } from '@shared/schemas/finance';

export type PaymentStep = 'counter' | 'agree' | 'issue' | 'paid-counter' | 'none';

/**
 * What the desk offers next for one compensation: money at the counter for cash or cheque; the passenger's agreement
 * before a card or credit the rule allows only with it; then the press that sends it to the provider.
 */
export function paymentStep(c: Pick<DeskCompensation, 'state' | 'medium' | 'payment'>): PaymentStep {
  if (c.payment.counterPayment) return 'paid-counter';
  if (c.state !== 'due') return 'none';
  if (c.medium === 'cash' || c.medium === 'cheque') return 'counter';
  const agreed = c.payment.agreement?.medium === c.medium;
  if (c.payment.terms.needsAgreement.includes(c.medium) && !agreed) return 'agree';
  return 'issue';
}
