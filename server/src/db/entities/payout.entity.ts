import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export type PaymentLinkPurpose = 'card-details' | 'payout';

/** A passenger's single-use link; the token itself is only in the e-mail, the row keeps its SHA-256. */
@Entity({ name: 'payment_links' })
@Index('ix_payment_link_compensation', ['compensationId', 'purpose'])
export class PaymentLinkEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'compensation_id' })
  compensationId!: number;

  @Column({ type: 'varchar', length: 16 })
  purpose!: PaymentLinkPurpose;

  /** The payment attempt (the compensation's idempotency key) the link belongs to; a re-issue makes new links. */
  @Column({ type: 'varchar', length: 80, name: 'attempt_key' })
  attemptKey!: string;

  @Index('uq_payment_link_token', { unique: true })
  @Column({ type: 'char', length: 64, name: 'token_hash' })
  tokenHash!: string;

  @Column({ type: 'datetime', precision: 3, name: 'expires_at' })
  expiresAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'used_at', nullable: true })
  usedAt!: Date | null;

  @Column({ type: 'int', name: 'wrong_tries', default: 0 })
  wrongTries!: number;

  @Column({ type: 'datetime', precision: 3, name: 'created_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt!: Date;
}

export type PayoutState = 'awaiting-details' | 'ready' | 'processing' | 'posted' | 'failed' | 'returned';

/** One bank transfer attempt: the passenger's account as the provider's payment method, never its number. */
@Entity({ name: 'payouts' })
@Index('ix_payout_compensation', ['compensationId'])
@Index('ix_payout_state', ['state', 'leaseUntil'])
export class PayoutEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'compensation_id' })
  compensationId!: number;

  @Index('uq_payout_attempt', { unique: true })
  @Column({ type: 'varchar', length: 80, name: 'attempt_key' })
  attemptKey!: string;

  @Column({ type: 'varchar', length: 16, default: 'awaiting-details' })
  state!: PayoutState;

  @Column({ type: 'int', name: 'amount_minor' })
  amountMinor!: number;

  @Column({ type: 'char', length: 3 })
  currency!: string;

  @Column({ type: 'varchar', length: 64, name: 'payment_method_id', nullable: true })
  paymentMethodId!: string | null;

  @Column({ type: 'char', length: 4, name: 'account_last4', nullable: true })
  accountLast4!: string | null;

  @Index('uq_payout_provider_payment', { unique: true })
  @Column({ type: 'varchar', length: 64, name: 'provider_payment_id', nullable: true })
  providerPaymentId!: string | null;

  /** A worker's claim while it calls the provider (see db/claim-rows); past its lease it is free again (the worker died). */
  @Column({ type: 'varchar', length: 96, name: 'claimed_by', nullable: true })
  claimedBy!: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'lease_until', nullable: true })
  leaseUntil!: Date | null;

  @Column({ type: 'varchar', length: 300, name: 'last_error', nullable: true })
  lastError!: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'created_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'updated_at', default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)' })
  updatedAt!: Date;
}
