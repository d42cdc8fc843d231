import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * Something a station and finance must act on, kept until it is resolved: a compensation whose payment was voided,
 * canceled at the provider, refused, or is near or past its deadline; a passenger who volunteered from their phone;
 * an amount waiting for a supervisor or just decided; a denial proposal waiting for a supervisor. One row per lost
 * payment attempt or per subject (the dedupe key), whoever notices it first.
 */
@Entity({ name: 'alerts' })
@Index('uq_alert_dedupe', ['dedupeKey'], { unique: true })
@Index('ix_alert_station_open', ['stationId', 'resolvedAt'])
@Index('ix_alert_compensation', ['compensationId'])
@Index('ix_alert_volunteer_id', ['volunteerId'])
@Index('ix_alert_approval_id', ['approvalId'])
@Index('ix_alert_denial_proposal_id', ['denialProposalId'])
export class AlertEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'flight_id', nullable: true })
  flightId!: number | null;

  @Column({ type: 'int', name: 'compensation_id', nullable: true })
  compensationId!: number | null;

  /** What a work alert is about; it closes by itself once its subject is decided (see the alerts service). */
  @Column({ type: 'int', name: 'volunteer_id', nullable: true })
  volunteerId!: number | null;

  @Column({ type: 'int', name: 'approval_id', nullable: true })
  approvalId!: number | null;

  @Column({ type: 'int', name: 'denial_proposal_id', nullable: true })
  denialProposalId!: number | null;

  @Column({ type: 'varchar', length: 32 })
  kind!: string;

  @Column({ type: 'varchar', length: 400 })
  message!: string;

  @Column({ type: 'varchar', length: 160, name: 'dedupe_key' })
  dedupeKey!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'resolved_at', nullable: true })
  resolvedAt!: Date | null;

  @Column({ type: 'varchar', length: 200, nullable: true })
  resolution!: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'acknowledged_at', nullable: true })
  acknowledgedAt!: Date | null;

  @Column({ type: 'int', name: 'acknowledged_by_user_id', nullable: true })
  acknowledgedByUserId!: number | null;
}
