// The period report's lines for EU 261, UK 261 and APPR stations. Those rules prescribe no reporting form; these
// are the same facts as Form 251 (volunteers, denials, what is owed and paid, cabin changes), each line with the
// article it rests on.
import { bandLabel } from '@shared/compensation/labels';
import type { ReportLine } from '@shared/schemas/finance';
import { hasCompensation, isLost, isOwed, isPaid, line, owedMinor, sumByCurrency, type CabinChangeItem, type ReportItem } from './report-items';

type NonUsRegime = 'eu-261' | 'uk-261' | 'ca-appr';

interface Sources {
  volunteers: string;
  denied: string;
  owed: string;
  paid: string;
  vouchers: string;
  downgrade: string;
  upgrade: string;
}

const EU = 'Reg. (EC) 261/2004';
const UK = 'Retained Reg. 261/2004 as amended by SI 2019/278';
const CA = 'SOR/2019-150 (APPR)';

const SOURCES: Record<NonUsRegime, Sources> = {
  'eu-261': {
    volunteers: `${EU} Art. 4(1): volunteers surrender their reservations for benefits agreed with them`,
    denied: `${EU} Art. 4(3): passengers denied boarding against their will`,
    owed: `${EU} Art. 7(1): EUR 250 / 400 / 600 by distance band`,
    paid: `${EU} Art. 7(3): cash, bank transfer or cheque`,
    vouchers: `${EU} Art. 7(3): travel vouchers only with the passenger’s signed agreement`,
    downgrade: `${EU} Art. 10(2): 30 % / 50 % / 75 % of the ticket price by distance band`,
    upgrade: `${EU} Art. 10(1): no supplementary payment may be asked`,
  },
  'uk-261': {
    volunteers: `${UK}, Art. 4(1)`,
    denied: `${UK}, Art. 4(3)`,
    owed: `${UK}, Art. 7(1): GBP 220 / 350 / 520 by distance band`,
    paid: `${UK}, Art. 7(3)`,
    vouchers: `${UK}, Art. 7(3): vouchers only with the passenger’s signed agreement`,
    downgrade: `${UK}, Art. 10(2): 30 % / 50 % / 75 % of the ticket price by distance band`,
    upgrade: `${UK}, Art. 10(1)`,
  },
  'ca-appr': {
    volunteers: `${CA}: volunteers asked for first, benefits confirmed in writing (section numbers from memory)`,
    denied: `${CA}: denial of boarding within the carrier’s control (section numbers from memory)`,
    owed: `${CA}: CAD 900 / 1,800 / 2,400 by arrival delay at the destination on the ticket`,
    paid: `${CA}: compensation in money`,
    vouchers: `${CA}: another form only if the passenger accepts it in writing and it is of greater value (from memory)`,
    downgrade: `${CA}: refund of the fare difference for a lower class of service (from memory)`,
    upgrade: `${CA}: no charge for a higher class of service (from memory)`,
  },
};

export function regimeLines(regime: NonUsRegime, items: readonly ReportItem[], totalBoardings: number, cabinChanges: readonly CabinChangeItem[] = []): ReportLine[] {
  const src = SOURCES[regime];
  const volunteers = items.filter((i) => i.voluntary);
  const involuntary = items.filter((i) => !i.voluntary);
  const owedSomething = involuntary.filter((i) => hasCompensation(i) && i.amountMinor > 0);
  const owedNothing = involuntary.filter((i) => hasCompensation(i) && i.amountMinor === 0);
  const pending = involuntary.length - owedSomething.length - owedNothing.length;
  const paid = (list: readonly ReportItem[]) => list.filter(isPaid);
  const unpaid = items.filter(isOwed);
  const lost = unpaid.filter(isLost);
  const bands = [...new Set(owedSomething.map((i) => i.band))].sort();
  const vouchers = paid(items).filter((i) => i.form === 'voucher');
  const ups = cabinChanges.filter((c) => c.direction === 'upgrade');
  const downs = cabinChanges.filter((c) => c.direction === 'downgrade');
  return [
    line('V1', 'Passengers who volunteered to give up their seats', src.volunteers, volunteers.length),
    line('V2', 'Compensation paid to volunteers (any form they accepted)', src.volunteers, null, sumByCurrency(paid(volunteers), (i) => i.amountMinor)),
    line('D1', 'Passengers denied boarding against their will', src.denied, involuntary.length, null, pending ? `${pending} of them have no compensation worked out yet.` : null),
    line('D2', 'of whom owed compensation', src.owed, owedSomething.length),
    // Numbered sub-lines: the engine's band codes are not for people to read.
    ...bands.map((band, n) => line(`D2.${n + 1}`, `owed compensation: ${bandLabel(band)}`, src.owed, owedSomething.filter((i) => i.band === band).length, sumByCurrency(owedSomething.filter((i) => i.band === band), (i) => i.amountMinor))),
    line('D3', 'of whom owed no compensation (an exemption, or outside the rules)', src.owed, owedNothing.length),
    line('D4', 'Passengers denied boarding who received compensation', src.paid, paid(owedSomething).length),
    line('D5', 'Compensation paid to passengers denied boarding (any form they accepted)', src.paid, null, sumByCurrency(paid(owedSomething), (i) => i.amountMinor)),
    line('D5-vouchers', 'of which travel vouchers, with the passenger’s agreement', src.vouchers, vouchers.filter((i) => !i.voluntary).length, sumByCurrency(vouchers.filter((i) => !i.voluntary), (i) => i.amountMinor)),
    line('O', 'Compensation owed, not yet paid (volunteers and denied passengers)', 'Bumpboard ledger: due, being issued, or a payment voided, canceled or refused', unpaid.length, sumByCurrency(unpaid, owedMinor),
      lost.length ? `${lost.length} of them had a payment voided, canceled or refused and wait for a re-issue.` : null),
    line('C1', 'Passengers placed in a higher class than booked', src.upgrade, ups.length),
    line('C2', 'Passengers placed in a lower class than booked, and what they are owed back', src.downgrade, downs.length, sumByCurrency(downs, (c) => c.owedMinor)),
    line('T', 'Total boardings', 'Bumpboard boarding records: passengers boarded on the station’s flights', totalBoardings),
  ];
}
