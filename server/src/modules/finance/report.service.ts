// The period report: one quarter at one station. Denials are read from the denials records when they carry a
// category; otherwise every involuntary compensation is classified from what the rules engine recorded.
import Papa from 'papaparse';
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { PeriodReport } from '@shared/schemas/finance';
import { StationEntity } from '../../db/entities';
import { stationScope, decimalAmount } from './scope';
import { quarterRange } from './quarter';
import type { CompensationStateCode } from '@shared/schemas/finance';
import { isPaid, perDay, type CabinChangeItem } from './report-items';
import { categoryFromCompensation, form251Lines, paidInMoneyForForm251, type Form251Category, type ReportItem } from './report-lines';
import { regimeLines } from './regime-lines';
import { NOT_A_REFUND, refundReportLines } from './refund-lines';
import { REFUND_PAYMENT_KINDS } from '@shared/schemas/refunds';
import { mediumLines, type MediumFact } from './report-media';

const TITLES: Record<string, { form: PeriodReport['form']; title: string }> = {
  'us-dot': { form: 'us-form-251', title: 'Form 251: passengers denied confirmed space (14 CFR 250.10)' },
  'eu-261': { form: 'eu-261', title: 'Denied boarding under Regulation (EC) 261/2004: counts and sums' },
  'uk-261': { form: 'uk-261', title: 'Denied boarding under UK Regulation 261: counts and sums' },
  'ca-appr': { form: 'ca-appr', title: 'Denied boarding under the Air Passenger Protection Regulations: counts and sums' },
};

interface CompensationFact {
  id: number;
  source_kind: string;
  source_id: number;
  voluntary: number;
  amount_minor: number;
  currency: string;
  state: CompensationStateCode;
  form: 'prepaid-card' | 'voucher';
  band: string;
  rule_ref: string;
  explanation: string;
  service_date: string;
  spent_minor: number | string;
}

let denialsReadable: boolean | null = null;

async function denialsHaveCategories(db: DataSource): Promise<boolean> {
  if (denialsReadable !== null) return denialsReadable;
  const [{ n }] = await db.query(
    `SELECT COUNT(*) AS n FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = 'denials' AND column_name IN ('category', 'passenger_ids', 'status', 'flight_id', 'station_id')`,
  );
  denialsReadable = Number(n) === 5;
  return denialsReadable;
}

// Every compensation stays an item whatever its payment state: voided, canceled or refused payments leave it owed.
const toItem = (c: CompensationFact, category: Form251Category | null): ReportItem => ({
  serviceDate: c.service_date, voluntary: Boolean(c.voluntary), category, band: c.band, amountMinor: c.amount_minor, currency: c.currency, state: c.state, form: c.form, spentMinor: Number(c.spent_minor),
});

/** The one query behind both the lines and the chart: one item per passenger of the quarter. */
async function reportItems(db: DataSource, station: StationEntity, from: string, to: string): Promise<{ items: ReportItem[]; source: PeriodReport['source'] }> {
  const facts: CompensationFact[] = await db.query(
    `SELECT c.id, c.source_kind, c.source_id, c.voluntary, c.amount_minor, c.currency, c.state, c.form, c.band, c.rule_ref, c.explanation,
            DATE_FORMAT(f.service_date, '%Y-%m-%d') AS service_date,
            (SELECT COALESCE(SUM(pc.spent_minor), 0) FROM provider_cards pc WHERE pc.compensation_id = c.id) AS spent_minor
       FROM compensations c JOIN flights f ON f.id = c.flight_id
      WHERE c.station_id = ? AND f.service_date BETWEEN ? AND ? AND ${NOT_A_REFUND}`,
    [station.id, from, to, REFUND_PAYMENT_KINDS],
  );
  const us = station.regime === 'us-dot';
  const volunteers = facts.filter((c) => c.voluntary).map((c) => toItem(c, null));
  if (!(await denialsHaveCategories(db))) {
    const involuntary = facts.filter((c) => !c.voluntary).map((c) => toItem(c, us ? categoryFromCompensation(c.band, c.rule_ref, c.explanation) : null));
    return { items: [...volunteers, ...involuntary], source: 'compensations' };
  }
  const denials: { id: number; category: Form251Category | null; passenger_ids: string | number[]; service_date: string }[] = await db.query(
    `SELECT d.id, d.category, d.passenger_ids, DATE_FORMAT(f.service_date, '%Y-%m-%d') AS service_date FROM denials d JOIN flights f ON f.id = d.flight_id
      WHERE d.station_id = ? AND d.status = 'authorized' AND f.service_date BETWEEN ? AND ?`,
    [station.id, from, to],
  );
  const byDenial = new Map<number, CompensationFact[]>();
  for (const c of facts) if (!c.voluntary && c.source_kind === 'denial') byDenial.set(c.source_id, [...(byDenial.get(c.source_id) ?? []), c]);
  const involuntary: ReportItem[] = [];
  for (const d of denials) {
    const passengers = typeof d.passenger_ids === 'string' ? (JSON.parse(d.passenger_ids) as number[]) : d.passenger_ids;
    const comps = byDenial.get(d.id) ?? [];
    for (const c of comps) involuntary.push(toItem(c, d.category));
    // A passenger of the denial with no compensation row yet is still a denied passenger.
    for (let i = comps.length; i < passengers.length; i += 1) {
      involuntary.push({ serviceDate: d.service_date, voluntary: false, category: d.category, band: '', amountMinor: 0, currency: station.currency, state: null, form: null, spentMinor: 0 });
    }
  }
  return { items: [...volunteers, ...involuntary], source: 'denials' };
}

async function cabinChangeItems(db: DataSource, stationId: number, from: string, to: string): Promise<CabinChangeItem[]> {
  const rows: { service_date: string; direction: 'upgrade' | 'downgrade'; owed_minor: number; currency: string }[] = await db.query(
    `SELECT DATE_FORMAT(f.service_date, '%Y-%m-%d') AS service_date, cc.direction, cc.owed_minor, cc.currency
       FROM cabin_changes cc JOIN flights f ON f.id = cc.flight_id
      WHERE cc.station_id = ? AND f.service_date BETWEEN ? AND ?`,
    [stationId, from, to],
  );
  return rows.map((r) => ({ serviceDate: r.service_date, direction: r.direction, owedMinor: r.owed_minor, currency: r.currency }));
}

/** Each compensation of the quarter with its medium's own record: counter payment, current transfer, cards. */
async function mediumFacts(db: DataSource, stationId: number, from: string, to: string): Promise<MediumFact[]> {
  const rows: { medium: MediumFact['medium']; state: string; amount_minor: number; currency: string; credit_value_minor: number | null; counter_paid: number | null; drawer_id: string | null; cheque_number: string | null; transfer_state: string | null; spent_minor: number | string; live_card: number | string }[] = await db.query(
    `SELECT c.medium, c.state, c.amount_minor, c.currency, c.credit_value_minor, cp.amount_minor AS counter_paid, cp.drawer_id, cp.cheque_number, p.state AS transfer_state,
            (SELECT COALESCE(SUM(pc.spent_minor), 0) FROM provider_cards pc WHERE pc.compensation_id = c.id) AS spent_minor,
            EXISTS (SELECT 1 FROM provider_cards pc WHERE pc.compensation_id = c.id AND pc.status <> 'canceled') AS live_card
       FROM compensations c JOIN flights f ON f.id = c.flight_id
       LEFT JOIN counter_payments cp ON cp.compensation_id = c.id
       LEFT JOIN payouts p ON p.compensation_id = c.id AND p.attempt_key = c.idempotency_key
      WHERE c.station_id = ? AND f.service_date BETWEEN ? AND ?`,
    [stationId, from, to],
  );
  return rows.map((r) => ({
    medium: r.medium, state: r.state, amountMinor: r.amount_minor, currency: r.currency, creditValueMinor: r.credit_value_minor, counterPaidMinor: r.counter_paid,
    drawerId: r.drawer_id, chequeNumber: r.cheque_number, transferState: r.transfer_state, spentMinor: Number(r.spent_minor), liveCard: Number(r.live_card) === 1,
  }));
}

export async function periodReport(db: DataSource, user: SessionUser, quarter: string, stationId: number): Promise<PeriodReport> {
  stationScope(user, stationId);
  const station = await db.getRepository(StationEntity).findOneByOrFail({ id: stationId });
  const { from, to } = quarterRange(quarter);
  const [{ items, source }, cabinChanges, refundLines, byMedium] = await Promise.all([
    reportItems(db, station, from, to), cabinChangeItems(db, station.id, from, to), refundReportLines(db, station.id, from, to),
    mediumFacts(db, station.id, from, to).then(mediumLines),
  ]);
  const [{ boarded }] = await db.query(
    `SELECT COUNT(*) AS boarded FROM passengers p JOIN flights f ON f.id = p.flight_id WHERE f.station_id = ? AND f.service_date BETWEEN ? AND ? AND p.status = 'boarded'`,
    [station.id, from, to],
  );
  const us = station.regime === 'us-dot';
  const kind = TITLES[station.regime] ?? TITLES['eu-261'];
  const notes = [
    'Counts are passengers; amounts are in the currency paid.',
    'A denial or a volunteer’s agreement stays counted whatever became of its payment: a payment voided, canceled by the provider or refused leaves the passenger owed.',
    us
      ? 'Line 8 counts money paid only (cash or a prepaid card without spending restrictions), never the value of travel vouchers, as the form’s instructions require.'
      : 'Paid amounts count any form the passenger accepted; travel vouchers are shown on their own line.',
    'By medium: paid is what each medium’s own record shows (the drawers, the cheque register, transfers sent, card spending); outstanding is value still on a live card, for a travel credit a liability until it is used.',
    'The chart adds up to the table: its paid figures are the paid lines, day by day, and its owed figure is the owed line.',
    source === 'compensations' ? 'Involuntary denials were classified from the compensation rules recorded for each passenger.' : 'Involuntary denials were counted from the authorized denial records and their categories.',
    'The tool computes what the configured rules say; the applicable regulation, the contract of carriage and the carrier’s compliance staff decide what is filed.',
  ];
  return {
    quarter, from, to,
    station: { id: station.id, iata: station.iata, name: station.name, regime: station.regime, currency: station.currency },
    form: kind.form, title: kind.title, source,
    lines: [...(us ? form251Lines(items, Number(boarded), cabinChanges) : regimeLines(station.regime as 'eu-261' | 'uk-261' | 'ca-appr', items, Number(boarded), cabinChanges)), ...refundLines],
    perDay: perDay(items, us ? paidInMoneyForForm251 : isPaid),
    byMedium,
    notes,
  };
}

/** One flat table: the lines (one row per currency where a line has money), then the days. */
export function reportCsv(report: PeriodReport): string {
  const rows: (string | number)[][] = [];
  for (const l of report.lines) {
    if (!l.amounts?.length) rows.push(['line', l.code, l.label, '', l.count ?? '', '', '', '', l.note ?? '', l.source]);
    for (const a of l.amounts ?? []) rows.push(['line', l.code, l.label, '', l.count ?? '', a.currency, a.amountMinor, decimalAmount(a.amountMinor, a.currency), l.note ?? '', l.source]);
  }
  for (const d of report.perDay) {
    rows.push(['day', 'voluntary-paid', 'Paid to volunteers', d.date, '', d.currency, d.voluntaryPaidMinor, decimalAmount(d.voluntaryPaidMinor, d.currency), '']);
    rows.push(['day', 'involuntary-paid', 'Paid for involuntary denials', d.date, '', d.currency, d.involuntaryPaidMinor, decimalAmount(d.involuntaryPaidMinor, d.currency), '']);
    rows.push(['day', 'owed', 'Owed, not yet paid', d.date, '', d.currency, d.owedMinor, decimalAmount(d.owedMinor, d.currency), '']);
  }
  // One row per medium, currency and figure, so a spreadsheet filters a medium in one click.
  for (const m of report.byMedium) {
    const figures: [string, string, number][] = [['owed', 'Owed through it', m.owedMinor], ['paid', `Paid (${m.recordedIn})`, m.paidMinor], ['outstanding', 'Outstanding on live cards', m.outstandingMinor]];
    if (m.medium === 'travel-credit') figures.push(['credit-value', 'Value of the credits issued', m.creditValueMinor]);
    for (const [code, label, amount] of figures) rows.push(['medium', `${m.medium}-${code}`, label, '', m.count, m.currency, amount, decimalAmount(amount, m.currency), m.detail, m.recordedIn]);
  }
  return Papa.unparse({ fields: ['section', 'code', 'label', 'date', 'count', 'currency', 'amount_minor', 'amount', 'note', 'source'], data: rows }, { escapeFormulae: true, newline: '\r\n' });
}
