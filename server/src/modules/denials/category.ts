// The line of the US denied-boarding report (DOT Form 251) a denial is counted on. The line structure is from
// memory: 1 = denied involuntarily and compensated (a: alternate transportation arranged, b: none offered);
// 2 = denied involuntarily and not compensated (a: alternate planned within 1 h, b: smaller aircraft substituted,
// c: ticketing, check-in, reconfirmation or acceptability requirements not met). Codes are this system's own.
import type { DenialCategory } from '@shared/schemas/denials';

export const CATEGORY_LABELS: Record<DenialCategory, string> = {
  '1a': 'Involuntary, compensated, alternate transportation arranged',
  '1b': 'Involuntary, compensated, no alternate transportation offered',
  '2a': 'Involuntary, not compensated: alternate planned to arrive within 1 hour',
  '2b': 'Involuntary, not compensated: smaller aircraft substituted (operational or safety reasons)',
  '2c': 'Involuntary, not compensated: ticketing, check-in, reconfirmation or acceptability requirements not met',
};

const EXEMPTION_CATEGORY: Readonly<Record<string, DenialCategory>> = {
  'us-smaller-aircraft': '2b',
  'us-weight-balance': '2b',
  'us-ticketing-checkin-acceptability': '2c',
  'eu-no-checkin': '2c',
  'uk-no-checkin': '2c',
  'us-alternate-within-1h': '2a',
};

export interface CategoryFacts {
  /** Band codes of the passengers' compensation (compensationDue's `band`). */
  bands: string[];
  exemption?: string;
  hasAlternate: boolean;
}

/** null when the case fits no line (e.g. an exemption the report does not list): a person classifies it. */
export function denialCategory(facts: CategoryFacts): DenialCategory | null {
  if (facts.exemption !== undefined) return EXEMPTION_CATEGORY[facts.exemption] ?? null;
  if (facts.bands.length === 0 || facts.bands.some((b) => b === 'out-of-scope' || b === 'not-computed' || b === 'exempt')) return null;
  if (facts.bands.every((b) => b === 'us-none-within-1h')) return '2a';
  return facts.hasAlternate ? '1a' : '1b';
}
