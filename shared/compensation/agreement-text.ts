// The exact words a passenger reads before accepting a prepaid card or a travel credit instead of money. Client and
// server build them from the same facts, so the text stored with the agreement is the text that was on the screen.
import { formatMoney } from './money';
import type { Medium } from './media';

export interface AgreementTextInput {
  passengerName: string;
  flight: string;
  serviceDate: string;
  medium: Extract<Medium, 'prepaid-card' | 'travel-credit'>;
  cashAmountMinor: number;
  valueMinor: number;
  currency: string;
  /** YYYY-MM-DD, or null when it never expires. */
  expiresOn: string | null;
  restrictions: readonly string[];
  ruleRef: string;
}

const NAMES = { 'prepaid-card': 'a prepaid card', 'travel-credit': 'a travel credit' } as const;

export function agreementText(input: AgreementTextInput): string {
  const cash = formatMoney(input.cashAmountMinor, input.currency);
  const value = formatMoney(input.valueMinor, input.currency);
  const lines = [
    `${input.passengerName}, flight ${input.flight} on ${input.serviceDate}.`,
    `You are owed ${cash}, payable in money (cash, cheque or bank transfer).`,
    `You may instead accept ${NAMES[input.medium]} worth ${value}. You may refuse it and take the money.`,
    input.expiresOn ? `It can be used until ${input.expiresOn}.` : 'It does not expire.',
    ...(input.restrictions.length ? [`Conditions: ${input.restrictions.map((r) => r.replace(/[.\s]+$/, '')).join('; ')}.`] : []),
    `Rule applied: ${input.ruleRef}.`,
    `By signing you accept ${NAMES[input.medium]} worth ${value} instead of ${cash} in money.`,
  ];
  return lines.join('\n');
}
