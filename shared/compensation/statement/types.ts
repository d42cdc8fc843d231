import type { CompensationResult, Regime } from '../types';
import type { PriorityRuleInput } from '../../denial/priority-rules.schema';

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
}

export interface StatementSection {
  heading: string;
  /** Plain text; lines starting with "- " are list items. */
  body: string;
}

export interface WrittenStatement {
  subject: string;
  sections: StatementSection[];
}
