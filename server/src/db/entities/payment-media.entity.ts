import type { Medium } from '@shared/compensation/media';
import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export type AgreementMethod = 'desk-signature' | 'phone' | 'recorded-statement';

/**
 * The passenger's agreement to be paid by prepaid card or travel credit instead of money: the exact text shown, the
 * cash amount given up and the value received, how and when they accepted, and the staff member who recorded it.
 */
@Entity({ name: 'payment_agreements' })
@Index('uq_agreement_compensation', ['compensationId'], { unique: true })
export class PaymentAgreementEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'compensation_id' })
  compensationId!: number;

  @Column({ type: 'varchar', length: 16 })
  medium!: Medium;

  @Column({ type: 'text' })
  text!: string;

  @Column({ type: 'int', name: 'cash_amount_minor' })
  cashAmountMinor!: number;

  @Column({ type: 'int', name: 'value_minor' })
  valueMinor!: number;

  @Column({ type: 'char', length: 3 })
  currency!: string;

  @Column({ type: 'date', name: 'expires_on', nullable: true })
  expiresOn!: string | null;

  @Column({ type: 'varchar', length: 20 })
  method!: AgreementMethod;

  /** A PNG data URL of the signature drawn on the desk's screen. */
  @Column({ type: 'mediumtext', nullable: true })
  signature!: string | null;

  @Column({ type: 'text', nullable: true })
  statement!: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'accepted_at' })
  acceptedAt!: Date;

  /** Null when the passenger accepted on their own phone. */
  @Column({ type: 'int', name: 'staff_user_id', nullable: true })
  staffUserId!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}

/** Money handed over at the counter, in cash from a drawer or by cheque, with the receipt the passenger signed. */
@Entity({ name: 'counter_payments' })
@Index('uq_counter_payment_compensation', ['compensationId'], { unique: true })
@Index('uq_counter_cheque', ['stationId', 'chequeNumber'], { unique: true })
@Index('ix_counter_drawer', ['stationId', 'drawerId', 'paidAt'])
export class CounterPaymentEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'compensation_id' })
  compensationId!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'varchar', length: 16 })
  medium!: 'cash' | 'cheque';

  @Column({ type: 'varchar', length: 32, name: 'drawer_id', nullable: true })
  drawerId!: string | null;

  @Column({ type: 'varchar', length: 32, name: 'cheque_number', nullable: true })
  chequeNumber!: string | null;

  @Column({ type: 'int', name: 'amount_minor' })
  amountMinor!: number;

  @Column({ type: 'char', length: 3 })
  currency!: string;

  @Column({ type: 'text', name: 'receipt_text' })
  receiptText!: string;

  @Column({ type: 'mediumtext' })
  signature!: string;

  @Column({ type: 'int', name: 'paid_by_user_id' })
  paidByUserId!: number;

  @Column({ type: 'datetime', precision: 3, name: 'paid_at' })
  paidAt!: Date;
}
