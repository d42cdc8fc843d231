// One query shape for every list of compensations (the desk, the ledger, a single row after an action), joined with
// what the provider last reported about the card.
import type { DataSource, EntityManager } from 'typeorm';
import type { Medium } from '@shared/compensation/media';
import type { CompensationView } from '@shared/schemas/finance';
import { notFound } from '../../domain/errors';
import type { CompensationSourceKind } from '../../db/entities/compensation.entity';

export const COMPENSATION_FROM = `
  FROM compensations c
  JOIN stations s ON s.id = c.station_id
  JOIN flights f ON f.id = c.flight_id
  LEFT JOIN passengers p ON p.id = c.passenger_id
  LEFT JOIN bookings b ON b.id = c.booking_id
  LEFT JOIN provider_cards pc ON pc.card_id = c.provider_card_id`;

export const COMPENSATION_COLUMNS = `
  c.id, c.station_id, s.iata AS station_iata, s.name AS station_name, c.flight_id, f.carrier_code, f.flight_number,
  DATE_FORMAT(f.service_date, '%Y-%m-%d') AS service_date, c.passenger_id, p.first_name, p.last_name, b.pnr, b.contact_email, b.language AS booking_language,
  c.source_kind, c.regime, c.voluntary, c.band, c.rule_ref, c.form, c.medium, c.due_by, c.amount_minor, c.currency, c.state, c.last_error,
  c.void_reason, c.voucher_agreed_at, c.created_at, c.updated_at, c.provider_card_id, c.provider_cardholder_id,
  pc.status AS pc_status, pc.limit_minor AS pc_limit_minor, pc.spent_minor AS pc_spent_minor, pc.currency AS pc_currency, pc.last4 AS pc_last4,
  pc.exp_month AS pc_exp_month, pc.exp_year AS pc_exp_year`;

export interface CompensationRow {
  id: number;
  station_id: number;
  station_iata: string;
  station_name: string;
  flight_id: number;
  carrier_code: string;
  flight_number: string;
  service_date: string;
  passenger_id: number;
  first_name: string | null;
  last_name: string | null;
  pnr: string | null;
  contact_email: string | null;
  source_kind: CompensationSourceKind;
  regime: string;
  voluntary: number | boolean;
  band: string;
  rule_ref: string;
  form: 'prepaid-card' | 'voucher';
  medium: Medium;
  due_by: Date | null;
  amount_minor: number;
  currency: string;
  state: CompensationView['state'];
  last_error: string | null;
  void_reason: string | null;
  voucher_agreed_at: Date | null;
  created_at: Date;
  updated_at: Date;
  provider_card_id: string | null;
  provider_cardholder_id: string | null;
  pc_status: string | null;
  pc_limit_minor: number | null;
  pc_spent_minor: number | null;
  pc_currency: string | null;
  pc_last4: string | null;
  pc_exp_month: number | null;
  pc_exp_year: number | null;
  /** The language the booking reads notices in; null when the booking system did not say. */
  booking_language: string | null;
}

export function passengerNameOf(row: Pick<CompensationRow, 'first_name' | 'last_name'>): string {
  return [row.first_name, row.last_name].filter(Boolean).join(' ') || 'Unknown passenger';
}

export function presentCompensation(row: CompensationRow): CompensationView {
  return {
    id: row.id,
    stationId: row.station_id,
    stationIata: row.station_iata,
    flightId: row.flight_id,
    flight: `${row.carrier_code} ${row.flight_number}`,
    serviceDate: row.service_date,
    passengerId: row.passenger_id,
    passengerName: passengerNameOf(row),
    pnr: row.pnr ?? '',
    sourceKind: row.source_kind,
    regime: row.regime,
    voluntary: Boolean(row.voluntary),
    band: row.band,
    ruleRef: row.rule_ref,
    form: row.form,
    medium: row.medium,
    dueBy: row.due_by ? new Date(row.due_by).toISOString() : null,
    amountMinor: row.amount_minor,
    currency: row.currency,
    state: row.state,
    lastError: row.last_error,
    voidReason: row.void_reason,
    voucherAgreedAt: row.voucher_agreed_at ? new Date(row.voucher_agreed_at).toISOString() : null,
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
    provider: row.provider_card_id
      ? {
          cardId: row.provider_card_id,
          cardholderId: row.provider_cardholder_id,
          status: row.pc_status ?? 'unknown',
          limitMinor: row.pc_limit_minor,
          spentMinor: row.pc_spent_minor ?? 0,
          currency: row.pc_currency,
          last4: row.pc_last4,
        }
      : null,
  };
}

export async function compensationRows(db: DataSource | EntityManager, where: string, params: unknown[], tail = 'ORDER BY c.id'): Promise<CompensationRow[]> {
  return db.query(`SELECT ${COMPENSATION_COLUMNS} ${COMPENSATION_FROM} WHERE ${where} ${tail}`, params);
}

export async function compensationRow(db: DataSource | EntityManager, id: number): Promise<CompensationRow> {
  const [row] = await compensationRows(db, 'c.id = ?', [id]);
  if (!row) throw notFound('Compensation');
  return row;
}
