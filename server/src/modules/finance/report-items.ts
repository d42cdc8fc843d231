// One record per passenger for the period report, and what each record means for the report's lines and chart.
// A denial or a volunteer's agreement is a fact; a payment is an attempt to settle it. A record therefore stays
// counted whatever became of its payment: a payment voided, canceled or refused makes the passenger owed again.
import { PAID_STATES, PAYMENT_LOST_STATES, type CompensationStateCode, type ReportDay, type ReportLine } from '@shared/schemas/finance';

export type Form251Category = '1a' | '1b' | '2a' | '2b' | '2c';

export interface ReportItem {
  /** The flight's service date: the day the denial or the volunteering happened. */
  serviceDate: string;
  voluntary: boolean;
  /** Form 251 line for an involuntary denial; null when it fits none (or the regime is not US). */
  category: Form251Category | null;
  band: string;
  amountMinor: number;
  currency: string;
  /** Where the payment stands; null for a denied passenger with no compensation worked out yet. */
  state: CompensationStateCode | null;
  form: 'prepaid-card' | 'voucher' | null;
  /** Spent by the passenger on this compensation's cards: before a loss, part of it may already have reached them. */
  spentMinor: number;
}

/** A passenger accommodated in another cabin of the same flight. */
export interface CabinChangeItem {
  serviceDate: string;
  direction: 'upgrade' | 'downgrade';
  owedMinor: number;
  currency: string;
}

export type Amounts = NonNullable<ReportLine['amounts']>;

export const isPaid = (i: ReportItem) => i.state !== null && (PAID_STATES as readonly string[]).includes(i.state);
export const isLost = (i: ReportItem) => i.state !== null && (PAYMENT_LOST_STATES as readonly string[]).includes(i.state);
/** What is still owed: nothing once paid; otherwise the amount less what was spent on a card since canceled. */
export const owedMinor = (i: ReportItem) => (i.state === null || isPaid(i) ? 0 : Math.max(0, i.amountMinor - i.spentMinor));
/** Owed and not paid: due, being issued, or a lost payment waiting for its re-issue. */
export const isOwed = (i: ReportItem) => owedMinor(i) > 0;
export const hasCompensation = (i: ReportItem) => i.state !== null;

export function sumByCurrency<T extends { currency: string }>(items: readonly T[], amount: (i: T) => number): Amounts {
  const sums = new Map<string, number>();
  for (const i of items) sums.set(i.currency, (sums.get(i.currency) ?? 0) + amount(i));
  return [...sums.entries()].sort(([a], [b]) => a.localeCompare(b)).map(([currency, amountMinor]) => ({ currency, amountMinor }));
}

export const line = (code: string, label: string, source: string, count: number | null, amounts: Amounts | null = null, note: string | null = null): ReportLine => ({ code, label, count, amounts, note, source });

/**
 * The chart's figures per flight date, from the very items the lines count, with the same rule for "paid"
 * (`paidMoney`), so the days add up to the paid lines and to the owed line.
 */
export function perDay(items: readonly ReportItem[], paidMoney: (i: ReportItem) => boolean): ReportDay[] {
  const days = new Map<string, ReportDay>();
  for (const i of items) {
    if (!hasCompensation(i)) continue;
    const key = `${i.serviceDate} ${i.currency}`;
    const day = days.get(key) ?? { date: i.serviceDate, currency: i.currency, voluntaryPaidMinor: 0, involuntaryPaidMinor: 0, owedMinor: 0 };
    if (paidMoney(i)) {
      if (i.voluntary) day.voluntaryPaidMinor += i.amountMinor;
      else day.involuntaryPaidMinor += i.amountMinor;
    }
    day.owedMinor += owedMinor(i);
    days.set(key, day);
  }
  return [...days.values()].sort((a, b) => a.date.localeCompare(b.date) || a.currency.localeCompare(b.currency));
}
