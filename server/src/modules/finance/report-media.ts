// The period report by medium: for each way the quarter's compensations were paid, what the ledger owes through it
// and what its own record says was paid — the drawers and the cheque register for cash and cheques, the provider's
// transfers for bank transfers, the provider's cards (spent and still on the card) for prepaid cards, and for travel
// credits the value issued, used, and still outstanding (a liability until used). Pure.
import { MEDIA, type Medium } from '@shared/compensation/media';
import type { ReportMediumLine } from '@shared/schemas/finance';

export interface MediumFact {
  medium: Medium;
  state: string;
  amountMinor: number;
  currency: string;
  /** A travel credit's agreed value (what its card holds); null otherwise. */
  creditValueMinor: number | null;
  /** The counter payment, for cash and cheques. */
  counterPaidMinor: number | null;
  drawerId: string | null;
  chequeNumber: string | null;
  /** The current transfer's state at the provider, for bank transfers. */
  transferState: string | null;
  /** Spent on the compensation's cards, and whether one of them is still live. */
  spentMinor: number;
  liveCard: boolean;
}

const RECORDED_IN: Record<Medium, string> = {
  cash: 'drawers (counter payments)',
  cheque: 'cheque register',
  'bank-transfer': 'transfers at the provider',
  'prepaid-card': 'cards at the provider',
  'travel-credit': 'credits issued (cards at the provider)',
};

/** Money sent by transfer: on its way (processing) or arrived (posted). */
const TRANSFER_SENT = new Set(['processing', 'posted']);
const OPEN_STATES = new Set(['issued', 'settled']);

function paidThrough(f: MediumFact): number {
  if (f.medium === 'cash' || f.medium === 'cheque') return f.counterPaidMinor ?? 0;
  if (f.medium === 'bank-transfer') return f.transferState && TRANSFER_SENT.has(f.transferState) ? f.amountMinor : 0;
  // A card or credit: what the passenger spent; the rest is still on the card.
  return f.spentMinor;
}

function outstanding(f: MediumFact): number {
  if (f.medium !== 'prepaid-card' && f.medium !== 'travel-credit') return 0;
  if (!f.liveCard || !OPEN_STATES.has(f.state)) return 0;
  const value = f.medium === 'travel-credit' ? (f.creditValueMinor ?? f.amountMinor) : f.amountMinor;
  return Math.max(0, value - f.spentMinor);
}

export function mediumLines(facts: readonly MediumFact[]): ReportMediumLine[] {
  const lines = new Map<string, ReportMediumLine & { drawers: Set<string>; cheques: number }>();
  for (const f of facts) {
    const key = `${f.medium}|${f.currency}`;
    let line = lines.get(key);
    if (!line) {
      line = { medium: f.medium, recordedIn: RECORDED_IN[f.medium], currency: f.currency, count: 0, owedMinor: 0, paidMinor: 0, outstandingMinor: 0, creditValueMinor: 0, detail: '', drawers: new Set(), cheques: 0 };
      lines.set(key, line);
    }
    line.count += 1;
    line.owedMinor += f.amountMinor;
    line.paidMinor += paidThrough(f);
    line.outstandingMinor += outstanding(f);
    if (f.medium === 'travel-credit' && OPEN_STATES.has(f.state)) line.creditValueMinor += f.creditValueMinor ?? f.amountMinor;
    if (f.drawerId) line.drawers.add(f.drawerId);
    if (f.chequeNumber) line.cheques += 1;
  }
  return [...lines.values()]
    .sort((a, b) => MEDIA.indexOf(a.medium) - MEDIA.indexOf(b.medium) || a.currency.localeCompare(b.currency))
    .map(({ drawers, cheques, ...line }) => ({
      ...line,
      detail: line.medium === 'cash' ? `${drawers.size} drawer${drawers.size === 1 ? '' : 's'}` : line.medium === 'cheque' ? `${cheques} cheque${cheques === 1 ? '' : 's'}` : '',
    }));
}
