// The refunds of one flight as the desk shows them, each with the state of the payment that carries it.
import type { DataSource } from 'typeorm';
import type { RuleRefundView } from '@shared/schemas/refunds';
import type { FlightEntity } from '../../db/entities';

interface Row {
  id: number; flight_id: number; passenger_id: number; first_name: string; last_name: string; kind: RuleRefundView['kind']; amount_minor: number; currency: string;
  rule_ref: string; lines: string | RuleRefundView['lines']; base_compensation_id: number; payment_compensation_id: number; state: RuleRefundView['paymentState'];
  medium: RuleRefundView['medium']; created_at: Date;
}

const present = (r: Row): RuleRefundView => ({
  id: r.id, flightId: r.flight_id, passengerId: r.passenger_id, passengerName: `${r.first_name} ${r.last_name}`, kind: r.kind, amountMinor: r.amount_minor,
  currency: r.currency, ruleRef: r.rule_ref, lines: typeof r.lines === 'string' ? JSON.parse(r.lines) : r.lines, baseCompensationId: r.base_compensation_id,
  paymentCompensationId: r.payment_compensation_id, paymentState: r.state, medium: r.medium, createdAt: new Date(r.created_at).toISOString(),
});

export async function listRefunds(db: DataSource, flight: FlightEntity): Promise<RuleRefundView[]> {
  const rows: Row[] = await db.query(
    `SELECT rr.*, p.first_name, p.last_name, c.state, c.medium
       FROM rule_refunds rr JOIN passengers p ON p.id = rr.passenger_id JOIN compensations c ON c.id = rr.payment_compensation_id
      WHERE rr.flight_id = ? ORDER BY rr.id`,
    [flight.id],
  );
  return rows.map(present);
}
