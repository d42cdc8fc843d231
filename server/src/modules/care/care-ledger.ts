// Care costs for finance, kept apart from compensation: the same station scope and service-date filter as the
// compensation ledger, totalled by kind (meals, hotel, transport, calls), by station and by flight, and exported as CSV.
import Papa from 'papaparse';
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { CareLedgerQuery, CareLedgerResponse } from '@shared/schemas/care';
import { decimalAmount, stationScope } from '../finance/scope';

type LedgerRow = CareLedgerResponse['rows'][number];
type Kind = LedgerRow['kind'];

interface Row {
  id: number; station_id: number; iata: string; flight_id: number; service_date: string | Date; carrier_code: string; flight_number: string; first_name: string; last_name: string;
  kind: Kind; description: string; amount_minor: number; currency: string; provided_by: string; recorded_at: Date;
}

interface GroupRow {
  station_id: number; iata: string; flight_id: number; service_date: string | Date; carrier_code: string; flight_number: string; kind: Kind; currency: string; n: string | number; amount: string | number;
}

/** The list on screen; the totals and the CSV cover every selected row. */
const SCREEN_ROWS = 5_000;
const CSV_ROWS = 100_000;

const dateText = (d: string | Date) => (typeof d === 'string' ? d.slice(0, 10) : d.toISOString().slice(0, 10));

function filterOf(user: SessionUser, query: CareLedgerQuery): { from: string; params: unknown[] } | null {
  const stations = stationScope(user, query.stationId);
  if (!stations.length) return null;
  // Only care with a cost reaches the ledger; a free call from the desk phone is recorded on the case, not here.
  const clauses = ['g.station_id IN (?)', 'g.amount_minor IS NOT NULL'];
  const params: unknown[] = [stations];
  if (query.from) { clauses.push('f.service_date >= ?'); params.push(query.from); }
  if (query.to) { clauses.push('f.service_date <= ?'); params.push(query.to); }
  return {
    from: `FROM care_given g JOIN flights f ON f.id = g.flight_id JOIN stations s ON s.id = g.station_id JOIN passengers p ON p.id = g.passenger_id WHERE ${clauses.join(' AND ')}`,
    params,
  };
}

async function ledgerRows(db: DataSource, filter: { from: string; params: unknown[] }, limit: number): Promise<LedgerRow[]> {
  const rows = (await db.query(
    `SELECT g.*, s.iata, f.service_date, f.carrier_code, f.flight_number, p.first_name, p.last_name ${filter.from} ORDER BY f.service_date DESC, g.id DESC LIMIT ${limit}`,
    filter.params,
  )) as Row[];
  return rows.map((r) => ({
    id: r.id, stationId: r.station_id, station: r.iata, flightId: r.flight_id, serviceDate: dateText(r.service_date), flight: `${r.carrier_code} ${r.flight_number}`,
    passengerName: `${r.first_name} ${r.last_name}`, kind: r.kind, description: r.description, amountMinor: Number(r.amount_minor), currency: r.currency,
    providedBy: r.provided_by, recordedAt: new Date(r.recorded_at).toISOString(),
  }));
}

/** Sums the finest grouping (station, flight, kind, currency) into each view; money never mixes currencies. */
function group<K extends string, E extends object>(rows: GroupRow[], keyOf: (r: GroupRow) => K, extra: (r: GroupRow) => E) {
  const out = new Map<string, E & { currency: string; count: number; amountMinor: number }>();
  for (const r of rows) {
    const key = `${keyOf(r)}|${r.currency}`;
    const held = out.get(key) ?? { ...extra(r), currency: r.currency, count: 0, amountMinor: 0 };
    held.count += Number(r.n);
    held.amountMinor += Number(r.amount);
    out.set(key, held);
  }
  return [...out.values()];
}

export async function careLedger(db: DataSource, user: SessionUser, query: CareLedgerQuery): Promise<CareLedgerResponse> {
  const filter = filterOf(user, query);
  if (!filter) return { rows: [], totals: [], byKind: [], byStation: [], byFlight: [] };
  const [rows, groups] = await Promise.all([
    ledgerRows(db, filter, SCREEN_ROWS),
    db.query(
      `SELECT g.station_id, s.iata, g.flight_id, f.service_date, f.carrier_code, f.flight_number, g.kind, g.currency, COUNT(*) AS n, SUM(g.amount_minor) AS amount
       ${filter.from} GROUP BY g.station_id, s.iata, g.flight_id, f.service_date, f.carrier_code, f.flight_number, g.kind, g.currency`,
      filter.params,
    ) as Promise<GroupRow[]>,
  ]);
  const byCurrency = (a: { currency: string }, b: { currency: string }) => a.currency.localeCompare(b.currency);
  return {
    rows,
    totals: group(groups, () => '', () => ({})).sort(byCurrency),
    byKind: group(groups, (r) => r.kind, (r) => ({ kind: r.kind })).sort((a, b) => a.kind.localeCompare(b.kind) || byCurrency(a, b)),
    byStation: group(groups, (r) => String(r.station_id), (r) => ({ stationId: r.station_id, station: r.iata })).sort((a, b) => a.station.localeCompare(b.station) || byCurrency(a, b)),
    byFlight: group(groups, (r) => String(r.flight_id), (r) => ({ flightId: r.flight_id, flight: `${r.carrier_code} ${r.flight_number}`, serviceDate: dateText(r.service_date), station: r.iata }))
      .sort((a, b) => b.serviceDate.localeCompare(a.serviceDate) || a.flight.localeCompare(b.flight) || byCurrency(a, b)),
  };
}

const CSV_COLUMNS = ['care_id', 'station', 'flight', 'service_date', 'passenger', 'kind', 'description', 'currency', 'amount', 'amount_minor', 'provided_by', 'recorded_at'];

/** Every selected row, in the list's order. Cells a spreadsheet would run as a formula are escaped. */
export async function careLedgerCsv(db: DataSource, user: SessionUser, query: CareLedgerQuery): Promise<string> {
  const filter = filterOf(user, query);
  const rows = filter ? await ledgerRows(db, filter, CSV_ROWS) : [];
  const data = rows.map((r) => [
    r.id, r.station, r.flight, r.serviceDate, r.passengerName, r.kind, r.description, r.currency, decimalAmount(r.amountMinor, r.currency), r.amountMinor, r.providedBy, r.recordedAt,
  ]);
  // OWASP "CSV Injection": a leading =, +, - or @ is neutralised (papaparse escapeFormulae).
  return Papa.unparse({ fields: CSV_COLUMNS, data }, { escapeFormulae: true, newline: '\r\n' });
}
