import type { CompensationResult, Regime } from '../types';
import type { PriorityRuleInput } from '../../denial/priority-rules.schema';
import type { Language } from '../../i18n/languages';

export interface StatementPassenger {
  name: string;
  pnr: string;
  ticketNumber?: string;
}

export interface StatementFlight {
  number: string;
  /** ISO date of the flight. */
  date: string;
  origin: string;
  destination: string;
  /** Scheduled arrival as printed for the passenger, e.g. "2025-03-01 14:05 local". */
  scheduledArrival?: string;
}

export interface StatementAlternate {
  flightNumber: string;
  /** Planned arrival as printed for the passenger. */
  plannedArrival: string;
  destination?: string;
}

export interface EnforcementBody {
  name: string;
  address?: string;
  website?: string;
  email?: string;
  phone?: string;
}

export interface VoucherOffer {
  valueMinor: number;
  currency: string;
  restrictions?: string;
}

export interface StatementInput {
  regime: Regime;
  carrierName: string;
  /** IATA code or name of the station issuing the statement. */
  station: string;
  passenger: StatementPassenger;
  flight: StatementFlight;
  /** null when no alternate transportation was offered. */
  alternate: StatementAlternate | null;
  compensation: CompensationResult;
  priorityRules: PriorityRuleInput[];
  /** Required for eu-261 (Art. 14(2)); defaults exist for uk-261 and ca-appr. */
  enforcementBody?: EnforcementBody;
  /** A travel voucher offered instead of money. */
  voucherOffer?: VoucherOffer;
  /** The passenger's language; English when absent. */
  language?: Language;
  /** What the passenger chose among the remedies the rule offers (refund, re-routing…), shown as "Your choice". */
  choice?: StatementChoice | null;
  /** Care given while the passenger waited, shown as "Care given". */
  care?: StatementCare[];
}

export interface StatementChoice {
  /** refund, reroute-earliest, reroute-later, rebook, or the rule's own word (shown as "Choice"). */
  kind: string;
  detail: string;
}

export interface StatementCare {
  kind: string;
  description: string;
  amountMinor?: number;
  currency?: string;
}

/** What a section is for, whatever its heading in the passenger's language: the completeness check reads these. */
export type SectionId =
  | 'about' | 'why' | 'case' | 'priorities' | 'compensation' | 'payment' | 'remedies' | 'alternate' | 'care-due'
  | 'enforcement' | 'choice' | 'care-given' | 'accessible' | 'caution'
  | 'us-250-9';

export interface StatementSection {
  id: SectionId;
  heading: string;
  /** Plain text; lines starting with "- " are list items. */
  body: string;
}

export interface WrittenStatement {
  regime: Regime;
  language: Language;
  subject: string;
  sections: StatementSection[];
}
