import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn, type Relation } from 'typeorm';
import { FlightEntity } from './flight.entity';
import { StationEntity } from './station.entity';

export type OutboxStatus = 'pending' | 'sent' | 'failed';

/**
 * One e-mail waiting to go out, or the record of one that went. Rows are written in the same transaction as
 * the business change they report, so a rolled-back action leaves nothing to send.
 */
@Entity({ name: 'outbox_messages' })
@Index('ix_outbox_due', ['status', 'nextAttemptAt'])
@Index('ix_outbox_flight', ['flightId', 'createdAt'])
@Index('uq_outbox_dedupe', ['dedupeKey'], { unique: true })
export class OutboxMessageEntity {
  /** A UUID, also stamped on the mail itself (Message-ID and X-Bumpboard-Message-Id) so a delivery can be traced. */
  @PrimaryColumn({ type: 'char', length: 36 })
  id!: string;

  // The relations mirror the migration's foreign keys by name, so a generated migration never drops them.
  @ManyToOne(() => StationEntity, { nullable: false, onDelete: 'NO ACTION', onUpdate: 'NO ACTION' })
  @JoinColumn({ name: 'station_id', foreignKeyConstraintName: 'fk_outbox_station' })
  station!: Relation<StationEntity>;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  /** A flight's notices go with the flight, as its bookings do. */
  @ManyToOne(() => FlightEntity, { nullable: true, onDelete: 'CASCADE', onUpdate: 'NO ACTION' })
  @JoinColumn({ name: 'flight_id', foreignKeyConstraintName: 'fk_outbox_flight' })
  flight!: Relation<FlightEntity> | null;

  @Column({ type: 'int', name: 'flight_id', nullable: true })
  flightId!: number | null;

  @Column({ type: 'json', name: 'passenger_ids' })
  passengerIds!: number[];

  /** What the notice is, e.g. 'volunteer-confirmation' or 'rebooking-notice'. */
  @Column({ type: 'varchar', length: 40 })
  kind!: string;

  @Column({ type: 'varchar', length: 254, name: 'to_address' })
  toAddress!: string;

  @Column({ type: 'varchar', length: 300 })
  subject!: string;

  @Column({ type: 'mediumtext' })
  text!: string;

  @Column({ type: 'mediumtext', nullable: true })
  html!: string | null;

  @Column({ type: 'varchar', length: 10, default: 'pending' })
  status!: OutboxStatus;

  /** Sends tried so far. */
  @Column({ type: 'int', default: 0 })
  attempts!: number;

  /** When a worker may next take the row (the retry time). */
  @Column({ type: 'datetime', precision: 3, name: 'next_attempt_at' })
  nextAttemptAt!: Date;

  /** The claim of the worker sending it (see db/claim-rows): a token of that claim, and when it lapses. */
  @Column({ type: 'varchar', length: 96, name: 'claimed_by', nullable: true })
  claimedBy!: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'lease_until', nullable: true })
  leaseUntil!: Date | null;

  @Column({ type: 'varchar', length: 500, name: 'last_error', nullable: true })
  lastError!: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'sent_at', nullable: true })
  sentAt!: Date | null;

  /** Names the business fact a message reports, so the same fact never enqueues a second message. */
  @Column({ type: 'varchar', length: 100, name: 'dedupe_key', nullable: true })
  dedupeKey!: string | null;
}
