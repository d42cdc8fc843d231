// Care costs for finance, kept apart from compensation: the same station scope and service-date filter as the
// compensation ledger, so the finance module can show both side by side (it calls careLedger, nothing more).
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { CareLedgerQuery, CareLedgerResponse } from '@shared/schemas/care';
import { stationScope } from '../finance/scope';

interface Row {
  id: number; station_id: number; flight_id: number; service_date: string | Date; carrier_code: string; flight_number: string; first_name: string; last_name: string;
  kind: CareLedgerResponse['rows'][number]['kind']; description: string; amount_minor: number; currency: string; provided_by: string; recorded_at: Date;
}

const dateText = (d: string | Date) => (typeof d === 'string' ? d.slice(0, 10) : d.toISOString().slice(0, 10));

/** Only care with a cost reaches the ledger; a free call from the desk phone is recorded on the case, not here. */
export async function careLedger(db: DataSource, user: SessionUser, query: CareLedgerQuery): Promise<CareLedgerResponse> {
  const stations = stationScope(user, query.stationId);
  if (!stations.length) return { rows: [], totals: [] };
  const clauses = ['g.station_id IN (?)', 'g.amount_minor IS NOT NULL'];
  const params: unknown[] = [stations];
  if (query.from) { clauses.push('f.service_date >= ?'); params.push(query.from); }
  if (query.to) { clauses.push('f.service_date <= ?'); params.push(query.to); }
  const from = `FROM care_given g JOIN flights f ON f.id = g.flight_id JOIN passengers p ON p.id = g.passenger_id WHERE ${clauses.join(' AND ')}`;
  const [rows, totals] = await Promise.all([
    db.query(`SELECT g.*, f.service_date, f.carrier_code, f.flight_number, p.first_name, p.last_name ${from} ORDER BY f.service_date DESC, g.id DESC LIMIT 5000`, params) as Promise<Row[]>,
    db.query(`SELECT g.currency, COUNT(*) AS n, SUM(g.amount_minor) AS amount ${from} GROUP BY g.currency ORDER BY g.currency`, params) as Promise<{ currency: string; n: string | number; amount: string | number }[]>,
  ]);
  return {
    rows: rows.map((r) => ({
      id: r.id, stationId: r.station_id, flightId: r.flight_id, serviceDate: dateText(r.service_date), flight: `${r.carrier_code} ${r.flight_number}`,
      passengerName: `${r.first_name} ${r.last_name}`, kind: r.kind, description: r.description, amountMinor: Number(r.amount_minor), currency: r.currency,
      providedBy: r.provided_by, recordedAt: new Date(r.recorded_at).toISOString(),
    })),
    totals: totals.map((t) => ({ currency: t.currency, count: Number(t.n), amountMinor: Number(t.amount) })),
  };
}
