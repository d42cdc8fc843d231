import type { Medium } from '@shared/compensation/media';
import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

export type CompensationSourceKind = 'volunteer' | 'denial' | 'top-up' | 'fee-refund' | 'cabin-refund';

export type CompensationState = 'due' | 'issuing' | 'issued' | 'settled' | 'failed' | 'voided' | 'canceled';

/**
 * What one passenger (of a volunteer or denied party) is owed for one flight, and where its payment stands. The unique
 * source key means the same fact can never create two compensations; the idempotency key is fixed before the first
 * call to the payment provider, so a retry can never issue twice.
 */
@Entity({ name: 'compensations' })
@Index('uq_compensation_source', ['sourceKind', 'sourceId', 'passengerId'], { unique: true })
@Index('ix_compensation_station_created', ['stationId', 'createdAt'])
export class CompensationEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'booking_id' })
  bookingId!: number;

  @Column({ type: 'int', name: 'passenger_id' })
  passengerId!: number;

  /**
   * 'volunteer' (agreed benefits), 'denial' (owed under the regime), or 'top-up' (the rest owed once the real arrival
   * is known), 'fee-refund' or 'cabin-refund' (a refund the rule adds, see rule_refunds); sourceId is the volunteer,
   * the denial, or the compensation topped up or refunded beside.
   */
  @Column({ type: 'varchar', length: 12, name: 'source_kind' })
  sourceKind!: CompensationSourceKind;

  @Column({ type: 'int', name: 'source_id' })
  sourceId!: number;

  @Column({ type: 'varchar', length: 16 })
  regime!: string;

  @Column({ type: 'boolean' })
  voluntary!: boolean;

  @Column({ type: 'int', name: 'amount_minor' })
  amountMinor!: number;

  @Column({ type: 'char', length: 3 })
  currency!: string;

  @Column({ type: 'varchar', length: 80, default: '' })
  band!: string;

  @Column({ type: 'varchar', length: 120, name: 'rule_ref', default: '' })
  ruleRef!: string;

  @Column({ type: 'text' })
  explanation!: string;

  /** prepaid-card (cash equivalent, the default) or voucher (only with the passenger's recorded agreement). */
  @Column({ type: 'varchar', length: 16, default: 'prepaid-card' })
  form!: 'prepaid-card' | 'voucher';

  /** How the money reaches the passenger; which media a rule allows is decided by the regime's payment terms. */
  @Column({ type: 'varchar', length: 16, default: 'prepaid-card' })
  medium!: Medium;

  /** The latest moment the rule allows for payment (paymentTerms); null when the rule sets no period. */
  @Column({ type: 'datetime', precision: 3, name: 'due_by', nullable: true })
  dueBy!: Date | null;

  @Column({ type: 'varchar', length: 120, name: 'due_rule_ref', nullable: true })
  dueRuleRef!: string | null;

  /** A travel credit's value to the passenger (the cash amount given up is amountMinor). */
  @Column({ type: 'int', name: 'credit_value_minor', nullable: true })
  creditValueMinor!: number | null;

  @Column({ type: 'date', name: 'credit_expires_on', nullable: true })
  creditExpiresOn!: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'voucher_agreed_at', nullable: true })
  voucherAgreedAt!: Date | null;

  @Column({ type: 'varchar', length: 12, default: 'due' })
  state!: CompensationState;

  @Column({ type: 'varchar', length: 80, name: 'idempotency_key', nullable: true, unique: true })
  idempotencyKey!: string | null;

  @Column({ type: 'varchar', length: 64, name: 'provider_cardholder_id', nullable: true })
  providerCardholderId!: string | null;

  @Column({ type: 'varchar', length: 64, name: 'provider_card_id', nullable: true })
  providerCardId!: string | null;

  @Column({ type: 'varchar', length: 300, name: 'last_error', nullable: true })
  lastError!: string | null;

  @Column({ type: 'varchar', length: 200, name: 'void_reason', nullable: true })
  voidReason!: string | null;

  /**
   * How the amount was cleared against someone's limit: 'rule' (a denial's amount, from the regime), 'offer of round
   * N' (a posted offer, gated when it was set), 'limit of user N' or 'approval N'. Null: not cleared; issuing it above
   * the issuer's limit waits for a supervisor.
   */
  @Column({ type: 'varchar', length: 40, name: 'amount_cleared_by', nullable: true })
  amountClearedBy!: string | null;

  /** The claim of the worker issuing it at the provider (see db/claim-rows): a token of that claim, and when it lapses. */
  @Column({ type: 'varchar', length: 96, name: 'claimed_by', nullable: true })
  claimedBy!: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'lease_until', nullable: true })
  leaseUntil!: Date | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)', name: 'updated_at' })
  updatedAt!: Date;
}
