// BTS Form 251, "Report of Passengers Denied Confirmed Space" (OMB No. 2138-0018), which 14 CFR 250.10 requires
// each quarter, as data: every line with the form's wording and the source of its definition beside it.
import type { ReportLine } from '@shared/schemas/finance';
import { hasCompensation, isLost, isOwed, isPaid, line, owedMinor, sumByCurrency, type CabinChangeItem, type Form251Category, type ReportItem } from './report-items';

export type { Form251Category, ReportItem } from './report-items';

const FORM = 'BTS Form 251 (OMB No. 2138-0018)';
/**
 * Line 8 counts money only. BTS's revised instructions for Form 251 (Reporting Directive of 30 June 2004, para. F),
 * as DOT's Aviation Consumer Protection Division restated them on 21 April 2006 ("Reporting oversales: value of
 * travel vouchers"): line 8 includes only cash or check payments, not the actual or estimated value of
 * transportation vouchers. A prepaid card without spending restrictions is read here as cash (our reading).
 */
export const LINE_8_SOURCE = `${FORM} line 8; BTS instructions para. F (30 Jun 2004), restated by DOT ACPD on 21 Apr 2006: cash or check only, never the value of transportation vouchers`;

/** Counted on line 8: paid, and paid in money (a prepaid card with no spending restrictions), never a voucher. */
export const paidInMoneyForForm251 = (i: ReportItem) => isPaid(i) && i.form !== 'voucher';

/** Classifies an involuntary US compensation by what the rules engine recorded, when no denial record says. */
export function categoryFromCompensation(band: string, ruleRef: string, explanation: string): Form251Category | null {
  if (band === 'us-200pct' || band === 'us-400pct') return /^No alternate transportation/i.test(explanation) ? '1b' : '1a';
  if (band === 'us-none-within-1h' || ruleRef.includes('250.6(d)')) return '2a';
  if (ruleRef.includes('250.6(b)')) return '2b';
  if (ruleRef.includes('250.6(a)')) return '2c';
  return null;
}

/** Lines 1 to 8 of the form, then two lines of our own (marked so) that finance needs beside it. */
export function form251Lines(items: readonly ReportItem[], totalBoardings: number, cabinChanges: readonly CabinChangeItem[] = []): ReportLine[] {
  const involuntary = items.filter((i) => !i.voluntary);
  const volunteers = items.filter((i) => i.voluntary);
  const of = (c: Form251Category) => involuntary.filter((i) => i.category === c);
  const counts = { '1a': of('1a').length, '1b': of('1b').length, '2a': of('2a').length, '2b': of('2b').length, '2c': of('2c').length };
  const unclassified = involuntary.filter((i) => i.category === null).length;
  const money = (list: readonly ReportItem[]) => sumByCurrency(list.filter(paidInMoneyForForm251), (i) => i.amountMinor);
  const vouchers = items.filter((i) => isPaid(i) && i.form === 'voucher');
  const owed = items.filter(isOwed);
  const lost = items.filter(isLost);
  const ups = cabinChanges.filter((c) => c.direction === 'upgrade');
  const downs = cabinChanges.filter((c) => c.direction === 'downgrade');
  return [
    line('1a', 'Denied boarding involuntarily, qualified for compensation, and given alternate transportation (§250.5)', `${FORM} line 1(a); 14 CFR 250.5`, counts['1a']),
    line('1b', 'Denied boarding involuntarily, qualified for compensation, and not given such alternate transportation', `${FORM} line 1(b); 14 CFR 250.5(a)(3)`, counts['1b']),
    line('2a', 'Denied involuntarily, not qualified: another flight arrived within 1 hour of the original’s scheduled arrival', `${FORM} line 2(a); 14 CFR 250.6(d)`, counts['2a']),
    line('2b', 'Denied involuntarily, not qualified: substitution of smaller-capacity equipment', `${FORM} line 2(b); 14 CFR 250.6(b)`, counts['2b']),
    line('2c', 'Denied involuntarily, not qualified: ticketing, check-in or reconfirmation rules not met, or not acceptable for transportation', `${FORM} line 2(c); 14 CFR 250.6(a)`, counts['2c']),
    line('3', 'Total denied boarding involuntarily (lines 1 and 2)', `${FORM} line 3 (the total of lines 1 and 2: from memory)`, counts['1a'] + counts['1b'] + counts['2a'] + counts['2b'] + counts['2c'],
      null, unclassified ? `${unclassified} involuntary denial(s) fit no line and are not counted; check their category.` : null),
    line('4', 'Denied boarding involuntarily who actually received compensation', `${FORM} line 4: compensation in any form the passenger received (cash, or a voucher the passenger accepted under 14 CFR 250.5(c))`,
      involuntary.filter((i) => isPaid(i) && i.amountMinor > 0).length),
    line('5', 'Volunteered to give up reserved space in exchange for the carrier’s compensation', `${FORM} line 5; 14 CFR 250.2b`, volunteers.length,
      null, volunteers.some(isLost) ? 'Counted whatever became of their payment: a voided or canceled payment does not undo the volunteering.' : null),
    line('6a', 'Accommodated in another section of the aircraft: upgrades', `${FORM} line 6(a); recorded at the desk as a cabin change`, ups.length),
    line('6b', 'Accommodated in another section of the aircraft: downgrades', `${FORM} line 6(b); 14 CFR 250.6(c) (refund of the fare difference)`, downs.length,
      downs.length ? sumByCurrency(downs, (c) => c.owedMinor) : null, downs.length ? 'Amounts: the fare difference owed back to the downgraded passengers (not part of the form).' : null),
    line('7', 'Total boardings', `${FORM} line 7; 14 CFR 250.10: only passengers on flights for which confirmed reservations are offered`, totalBoardings),
    line('8a', 'Compensation paid: denied involuntarily, given alternate transportation (line 1a)', LINE_8_SOURCE, null, money(of('1a'))),
    line('8b', 'Compensation paid: denied involuntarily, not given alternate transportation (line 1b)', LINE_8_SOURCE, null, money(of('1b'))),
    line('8c', 'Compensation paid: volunteers (line 5)', LINE_8_SOURCE, null, money(volunteers)),
    line('x-vouchers', 'Not on the form: value of travel vouchers issued (left out of line 8)', LINE_8_SOURCE, vouchers.length, sumByCurrency(vouchers, (i) => i.amountMinor)),
    line('x-owed', 'Not on the form: compensation owed and not yet paid', 'Bumpboard ledger: due, being issued, or a payment voided, canceled or refused', owed.length, sumByCurrency(owed, owedMinor),
      lost.length ? `${lost.length} of them had a payment voided, canceled or refused and wait for a re-issue.` : null),
    ...(hasUnworked(involuntary) ? [line('x-pending', 'Not on the form: denied passengers with no compensation worked out yet', 'Bumpboard denial records', involuntary.filter((i) => !hasCompensation(i)).length)] : []),
  ];
}

const hasUnworked = (list: readonly ReportItem[]) => list.some((i) => !hasCompensation(i));
