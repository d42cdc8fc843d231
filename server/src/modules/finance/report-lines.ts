// The quarterly report's lines, from one record per passenger. For US stations these are BTS Form 251, "Report of
// Passengers Denied Confirmed Space", which 14 CFR 250.10 requires each quarter; for EU, UK and Canadian stations
// Bumpboard's own equivalent counts and sums (those regimes prescribe no such form).
import { bandLabel } from '@shared/compensation/labels';
import type { ReportLine } from '@shared/schemas/finance';

export type Form251Category = '1a' | '1b' | '2a' | '2b' | '2c';

/** One passenger's compensation (or, for a denial without one, just the denial) in the quarter. */
export interface ReportItem {
  voluntary: boolean;
  /** Form 251 line for an involuntary denial; null when it fits none (or the regime is not US). */
  category: Form251Category | null;
  band: string;
  amountMinor: number;
  currency: string;
  /** The money left: issued or spent. */
  paid: boolean;
  voided: boolean;
  /** False for a denial counted from the denials records that has no compensation row yet. */
  hasCompensation: boolean;
}

type Amounts = NonNullable<ReportLine['amounts']>;

function sumByCurrency(items: readonly ReportItem[]): Amounts {
  const sums = new Map<string, number>();
  for (const i of items) sums.set(i.currency, (sums.get(i.currency) ?? 0) + i.amountMinor);
  return [...sums.entries()].sort(([a], [b]) => a.localeCompare(b)).map(([currency, amountMinor]) => ({ currency, amountMinor }));
}

const line = (code: string, label: string, count: number | null, amounts: Amounts | null = null, note: string | null = null): ReportLine => ({ code, label, count, amounts, note });

/** Classifies an involuntary US compensation by what the rules engine recorded, when no denial record says. */
export function categoryFromCompensation(band: string, ruleRef: string, explanation: string): Form251Category | null {
  if (band === 'us-200pct' || band === 'us-400pct') return /^No alternate transportation/i.test(explanation) ? '1b' : '1a';
  if (band === 'us-none-within-1h' || ruleRef.includes('250.6(d)')) return '2a';
  if (ruleRef.includes('250.6(b)')) return '2b';
  if (ruleRef.includes('250.6(a)')) return '2c';
  return null;
}

/**
 * Lines 1 to 8 of Form 251. Wording follows the form (BTS Form 251, OMB No. 2138-0018); line 3 is the total of
 * lines 1 and 2 (from memory); line 7 counts passengers boarded on the station's flights (14 CFR 250.10: only
 * flights for which confirmed reservations are offered).
 */
export function form251Lines(items: readonly ReportItem[], totalBoardings: number): ReportLine[] {
  const standing = items.filter((i) => !i.voided);
  const involuntary = standing.filter((i) => !i.voluntary);
  const of = (c: Form251Category) => involuntary.filter((i) => i.category === c);
  const paid = (list: readonly ReportItem[]) => list.filter((i) => i.paid && i.hasCompensation);
  const counts = { '1a': of('1a').length, '1b': of('1b').length, '2a': of('2a').length, '2b': of('2b').length, '2c': of('2c').length };
  const unclassified = involuntary.filter((i) => i.category === null).length;
  const volunteers = standing.filter((i) => i.voluntary);
  return [
    line('1a', 'Denied boarding involuntarily, qualified for compensation, and given alternate transportation (§250.5)', counts['1a']),
    line('1b', 'Denied boarding involuntarily, qualified for compensation, and not given such alternate transportation', counts['1b']),
    line('2a', 'Denied involuntarily, not qualified: another flight arrived within 1 hour of the original’s scheduled arrival', counts['2a']),
    line('2b', 'Denied involuntarily, not qualified: substitution of smaller-capacity equipment', counts['2b']),
    line('2c', 'Denied involuntarily, not qualified: ticketing, check-in or reconfirmation rules not met, or not acceptable for transportation', counts['2c']),
    line('3', 'Total denied boarding involuntarily (lines 1 and 2)', counts['1a'] + counts['1b'] + counts['2a'] + counts['2b'] + counts['2c'],
      null, unclassified ? `${unclassified} involuntary denial(s) fit no line and are not counted; check their category.` : null),
    line('4', 'Denied boarding involuntarily who actually received compensation', paid(involuntary.filter((i) => i.amountMinor > 0)).length),
    line('5', 'Volunteered to give up reserved space in exchange for the carrier’s compensation', volunteers.length),
    line('6a', 'Accommodated in another section of the aircraft: upgrades', null, null, 'Not tracked by Bumpboard; fill in from departure control.'),
    line('6b', 'Accommodated in another section of the aircraft: downgrades', null, null, 'Not tracked by Bumpboard; fill in from departure control.'),
    line('7', 'Total boardings', totalBoardings),
    line('8a', 'Compensation paid: denied involuntarily, given alternate transportation (line 1a)', null, sumByCurrency(paid(of('1a')))),
    line('8b', 'Compensation paid: denied involuntarily, not given alternate transportation (line 1b)', null, sumByCurrency(paid(of('1b')))),
    line('8c', 'Compensation paid: volunteers (line 5)', null, sumByCurrency(paid(volunteers))),
  ];
}

/** The same facts for EU 261, UK 261 and APPR stations, with involuntary denials broken down by band. */
export function regimeLines(items: readonly ReportItem[], totalBoardings: number): ReportLine[] {
  const standing = items.filter((i) => !i.voided);
  const volunteers = standing.filter((i) => i.voluntary);
  const involuntary = standing.filter((i) => !i.voluntary);
  const owed = involuntary.filter((i) => i.hasCompensation && i.amountMinor > 0);
  const owedNothing = involuntary.filter((i) => i.hasCompensation && i.amountMinor === 0);
  const pending = involuntary.length - owed.length - owedNothing.length;
  const paid = (list: readonly ReportItem[]) => list.filter((i) => i.paid && i.hasCompensation);
  const unpaid = owed.filter((i) => !i.paid);
  const bands = [...new Set(owed.map((i) => i.band))].sort();
  return [
    line('V1', 'Passengers who volunteered to give up their seats', volunteers.length),
    line('V2', 'Compensation paid to volunteers', null, sumByCurrency(paid(volunteers))),
    line('D1', 'Passengers denied boarding against their will', involuntary.length, null, pending ? `${pending} of them have no compensation worked out yet.` : null),
    line('D2', 'of whom owed compensation', owed.length),
    // Numbered sub-lines: the engine's band codes are not for people to read.
    ...bands.map((band, i) => line(`D2.${i + 1}`, `owed compensation: ${bandLabel(band)}`, owed.filter((i) => i.band === band).length, sumByCurrency(owed.filter((i) => i.band === band)))),
    line('D3', 'of whom owed no compensation (an exemption, or outside the rules)', owedNothing.length),
    line('D4', 'Passengers denied boarding who received compensation', paid(owed).length),
    line('D5', 'Compensation paid to passengers denied boarding', null, sumByCurrency(paid(owed))),
    line('D6', 'Compensation owed to passengers denied boarding, not yet paid', unpaid.length, sumByCurrency(unpaid)),
    line('T', 'Total boardings', totalBoardings),
  ];
}
