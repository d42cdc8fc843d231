import type { RuleRefundKind } from '@shared/schemas/refunds';
import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * A refund a rule adds to a denied passenger's compensation: the optional fees paid for services not received, or the
 * reimbursement of a downgrade. Paid through its own payment row (a compensations row of kind fee-refund or
 * cabin-refund), so the media, the agreement rules and the idempotency of payments apply to it unchanged; kept apart
 * from compensation in the ledger and the reports.
 */
@Entity({ name: 'rule_refunds' })
@Index('uq_rule_refund_payment', ['paymentCompensationId'], { unique: true })
@Index('ix_rule_refund_flight', ['flightId'])
export class RuleRefundEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'passenger_id' })
  passengerId!: number;

  /** The compensation (of a denial or a volunteer) this refund goes with. */
  @Column({ type: 'int', name: 'base_compensation_id' })
  baseCompensationId!: number;

  /** The payment row that carries this refund to the passenger. */
  @Column({ type: 'int', name: 'payment_compensation_id' })
  paymentCompensationId!: number;

  /** The recorded downgrade a downgrade refund comes from. */
  @Column({ type: 'int', name: 'cabin_change_id', nullable: true })
  cabinChangeId!: number | null;

  @Column({ type: 'varchar', length: 16 })
  kind!: RuleRefundKind;

  @Column({ type: 'int', name: 'amount_minor' })
  amountMinor!: number;

  @Column({ type: 'char', length: 3 })
  currency!: string;

  @Column({ type: 'varchar', length: 200, name: 'rule_ref' })
  ruleRef!: string;

  /** The fees refunded, one line each; a downgrade has one line. */
  @Column({ type: 'json' })
  lines!: { label: string; amountMinor: number }[];

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}
