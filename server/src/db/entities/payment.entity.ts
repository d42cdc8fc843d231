import type { Medium } from '@shared/compensation/media';
import type { MediumReconciliation } from '@shared/schemas/finance';
import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';

/**
 * Every webhook event the payment provider sent, stored once: the unique event id is what makes a redelivery
 * (the provider sends at least once) a quiet no-op.
 */
@Entity({ name: 'provider_events' })
@Index('uq_provider_event_id', ['eventId'], { unique: true })
export class ProviderEventEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'varchar', length: 255, name: 'event_id' })
  eventId!: string;

  @Column({ type: 'varchar', length: 100 })
  type!: string;

  @Column({ type: 'varchar', length: 64, name: 'object_id', nullable: true })
  objectId!: string | null;

  @Column({ type: 'int', name: 'compensation_id', nullable: true })
  compensationId!: number | null;

  /** What applying it did, e.g. 'issued', 'settled', 'ignored: already voided'. */
  @Column({ type: 'varchar', length: 120 })
  outcome!: string;

  /** The provider's own creation time of the event (epoch seconds), to tell old news from new. */
  @Column({ type: 'bigint', name: 'provider_created' })
  providerCreated!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'received_at' })
  receivedAt!: Date;
}

/**
 * Which provider account an issuance was started under (a fingerprint of the API URL and key). Only a worker
 * configured for the same account resumes it: the idempotency keys mean nothing in another account, and finishing
 * there would issue a second card.
 */
@Entity({ name: 'payment_issuances' })
export class PaymentIssuanceEntity {
  @PrimaryColumn({ type: 'int', name: 'compensation_id' })
  compensationId!: number;

  @Column({ type: 'char', length: 16, name: 'provider_account' })
  providerAccount!: string;

  @Column({ type: 'datetime', precision: 3, name: 'requested_at' })
  requestedAt!: Date;
}

/** What the provider last told us about one card, from its API answers and webhooks; shown beside the ledger. */
@Entity({ name: 'provider_cards' })
@Index('ix_provider_card_compensation', ['compensationId'])
export class ProviderCardEntity {
  @PrimaryColumn({ type: 'varchar', length: 64, name: 'card_id' })
  cardId!: string;

  @Column({ type: 'int', name: 'compensation_id', nullable: true })
  compensationId!: number | null;

  @Column({ type: 'varchar', length: 64, name: 'cardholder_id', nullable: true })
  cardholderId!: string | null;

  /** active | inactive | canceled, as the provider spells it. */
  @Column({ type: 'varchar', length: 16 })
  status!: string;

  @Column({ type: 'char', length: 3, nullable: true })
  currency!: string | null;

  @Column({ type: 'int', name: 'limit_minor', nullable: true })
  limitMinor!: number | null;

  @Column({ type: 'int', name: 'spent_minor', default: 0 })
  spentMinor!: number;

  @Column({ type: 'char', length: 4, nullable: true })
  last4!: string | null;

  @Column({ type: 'smallint', name: 'exp_month', nullable: true })
  expMonth!: number | null;

  @Column({ type: 'smallint', name: 'exp_year', nullable: true })
  expYear!: number | null;

  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)', name: 'updated_at' })
  updatedAt!: Date;
}

/**
 * A travel voucher offered in place of money: the cash amount and the voucher's restrictions as they were shown
 * and sent, then the passenger's agreement in their own words. Without both, no voucher is issued.
 */
@Entity({ name: 'voucher_offers' })
export class VoucherOfferEntity {
  @PrimaryColumn({ type: 'int', name: 'compensation_id' })
  compensationId!: number;

  @Column({ type: 'int', name: 'cash_amount_minor' })
  cashAmountMinor!: number;

  @Column({ type: 'char', length: 3 })
  currency!: string;

  @Column({ type: 'json' })
  restrictions!: string[];

  @Column({ type: 'text' })
  text!: string;

  @Column({ type: 'varchar', length: 254, name: 'sent_to', nullable: true })
  sentTo!: string | null;

  @Column({ type: 'int', name: 'offered_by_user_id' })
  offeredByUserId!: number;

  @Column({ type: 'datetime', precision: 3, name: 'offered_at' })
  offeredAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'agreed_at', nullable: true })
  agreedAt!: Date | null;

  @Column({ type: 'text', nullable: true })
  statement!: string | null;

  @Column({ type: 'int', name: 'agreed_recorded_by_user_id', nullable: true })
  agreedRecordedByUserId!: number | null;
}

export type ReconciliationStatus = 'running' | 'completed' | 'failed' | 'interrupted';

/** One comparison of the ledger with the provider's cards, kept with its differences. */
@Entity({ name: 'reconciliation_runs' })
@Index('ix_reconciliation_started', ['startedAt'])
export class ReconciliationRunEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'varchar', length: 16, default: 'running' })
  status!: ReconciliationStatus;

  @Column({ type: 'json', name: 'station_ids' })
  stationIds!: number[];

  @Column({ type: 'int', name: 'started_by_user_id', nullable: true })
  startedByUserId!: number | null;

  @Column({ type: 'varchar', length: 254, name: 'started_by_label' })
  startedByLabel!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'started_at' })
  startedAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'finished_at', nullable: true })
  finishedAt!: Date | null;

  @Column({ type: 'int', name: 'pages_read', default: 0 })
  pagesRead!: number;

  @Column({ type: 'int', name: 'cards_seen', default: 0 })
  cardsSeen!: number;

  @Column({ type: 'int', name: 'ledger_rows', default: 0 })
  ledgerRows!: number;

  @Column({ type: 'int', name: 'differences_found', default: 0 })
  differencesFound!: number;

  /** What each medium's comparison found, in the run's own words (see MediumReconciliation). */
  @Column({ type: 'json', name: 'by_medium', nullable: true })
  byMedium!: MediumReconciliation[] | null;

  @Column({ type: 'varchar', length: 500, nullable: true })
  error!: string | null;

  /** Moves with every page read: a run whose heartbeat stopped belongs to a process that is gone. */
  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)', name: 'heartbeat_at' })
  heartbeatAt!: Date;
}

@Entity({ name: 'reconciliation_differences' })
@Index('ix_reconciliation_difference_run', ['runId'])
export class ReconciliationDifferenceEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @ManyToOne(() => ReconciliationRunEntity, { nullable: false, onDelete: 'CASCADE', onUpdate: 'NO ACTION' })
  @JoinColumn({ name: 'run_id', foreignKeyConstraintName: 'fk_reconciliation_difference_run' })
  run!: Relation<ReconciliationRunEntity>;

  @Column({ type: 'int', name: 'run_id' })
  runId!: number;

  @Column({ type: 'varchar', length: 32 })
  kind!: string;

  /** Null on runs from before reconciliation read each medium apart. */
  @Column({ type: 'varchar', length: 16, nullable: true })
  medium!: Medium | null;

  @Column({ type: 'int', name: 'compensation_id', nullable: true })
  compensationId!: number | null;

  @Column({ type: 'varchar', length: 64, name: 'card_id', nullable: true })
  cardId!: string | null;

  @Column({ type: 'varchar', length: 200, name: 'ledger_value', nullable: true })
  ledgerValue!: string | null;

  @Column({ type: 'varchar', length: 200, name: 'provider_value', nullable: true })
  providerValue!: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'resolved_at', nullable: true })
  resolvedAt!: Date | null;

  @Column({ type: 'int', name: 'resolved_by_user_id', nullable: true })
  resolvedByUserId!: number | null;

  @Column({ type: 'varchar', length: 254, name: 'resolved_by_label', nullable: true })
  resolvedByLabel!: string | null;

  @Column({ type: 'varchar', length: 500, nullable: true })
  note!: string | null;
}
