import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * Something a station and finance must act on, kept until it is resolved: today, a compensation whose payment was
 * voided, canceled at the provider or refused, so the passenger is owed again. One row per lost payment attempt
 * (the dedupe key), whoever notices it first.
 */
@Entity({ name: 'alerts' })
@Index('uq_alert_dedupe', ['dedupeKey'], { unique: true })
@Index('ix_alert_station_open', ['stationId', 'resolvedAt'])
@Index('ix_alert_compensation', ['compensationId'])
export class AlertEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'flight_id', nullable: true })
  flightId!: number | null;

  @Column({ type: 'int', name: 'compensation_id', nullable: true })
  compensationId!: number | null;

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
