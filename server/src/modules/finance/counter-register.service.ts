// Finance's view of money handed over at the counters: cash per drawer (to reconcile with each drawer's count) and
// the cheque register. Reads the counter payments the payments side recorded; changes nothing.
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { CounterRegister, CounterRegisterQuery } from '@shared/schemas/payment-media';
import { stationScope } from './scope';

export async function counterRegister(db: DataSource, user: SessionUser, query: CounterRegisterQuery): Promise<CounterRegister> {
  const stations = stationScope(user, query.stationId);
  if (!stations.length) return { drawers: [], cheques: [] };
  const clauses = ['cp.station_id IN (?)'];
  const params: unknown[] = [stations];
  if (query.from) { clauses.push('f.service_date >= ?'); params.push(query.from); }
  if (query.to) { clauses.push('f.service_date <= ?'); params.push(query.to); }
  const from = 'FROM counter_payments cp JOIN compensations c ON c.id = cp.compensation_id JOIN flights f ON f.id = c.flight_id JOIN stations s ON s.id = cp.station_id LEFT JOIN passengers p ON p.id = c.passenger_id';
  const where = clauses.join(' AND ');
  const [drawers, cheques] = await Promise.all([
    db.query(`SELECT s.iata, cp.drawer_id, cp.currency, COUNT(*) AS n, SUM(cp.amount_minor) AS amount ${from} WHERE ${where} AND cp.medium = 'cash' GROUP BY s.iata, cp.drawer_id, cp.currency ORDER BY s.iata, cp.drawer_id, cp.currency`, params) as Promise<{ iata: string; drawer_id: string; currency: string; n: string | number; amount: string | number }[]>,
    db.query(`SELECT s.iata, cp.cheque_number, cp.compensation_id, p.first_name, p.last_name, cp.amount_minor, cp.currency, cp.paid_at ${from} WHERE ${where} AND cp.medium = 'cheque' ORDER BY s.iata, cp.cheque_number LIMIT 10000`, params) as Promise<{ iata: string; cheque_number: string; compensation_id: number; first_name: string | null; last_name: string | null; amount_minor: number; currency: string; paid_at: Date }[]>,
  ]);
  return {
    drawers: drawers.map((d) => ({ stationIata: d.iata, drawerId: d.drawer_id, currency: d.currency, count: Number(d.n), amountMinor: Number(d.amount) })),
    cheques: cheques.map((c) => ({
      stationIata: c.iata, chequeNumber: c.cheque_number, compensationId: c.compensation_id, passengerName: [c.first_name, c.last_name].filter(Boolean).join(' ') || 'Unknown passenger',
      amountMinor: c.amount_minor, currency: c.currency, paidAt: new Date(c.paid_at).toISOString(),
    })),
  };
}
