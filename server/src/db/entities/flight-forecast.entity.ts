import { Column, Entity, Index, PrimaryColumn, PrimaryGeneratedColumn } from 'typeorm';
import type { CompactForecast } from '@shared/events';

/** The latest figures per flight, read by every console; replaced on each recompute. */
@Entity({ name: 'flight_forecasts' })
export class FlightForecastEntity {
  @PrimaryColumn({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'datetime', precision: 3, name: 'computed_at' })
  computedAt!: Date;

  /** Rises by one on every write; a write never goes to a row whose figures were computed later (see forecast.service). */
  @Column({ type: 'int', unsigned: true, default: 0 })
  version!: number;

  @Column({ type: 'double', name: 'p_oversale' })
  pOversale!: number;

  @Column({ type: 'double', name: 'expected_denied' })
  expectedDenied!: number;

  /** The figures, with the distribution as its window (a few KB instead of tens). */
  @Column({ type: 'json' })
  forecast!: CompactForecast;

  /** Per-cabin figures as last computed (each passenger's probability and reason are computed when asked for). */
  @Column({ type: 'json' })
  detail!: object;

  /** The learned rates version the figures were computed with; null for the hand-set profile. */
  @Column({ type: 'int', name: 'rates_version', nullable: true })
  ratesVersion!: number | null;
}

/** The odds over time, for the chart since the gate opened. */
@Entity({ name: 'forecast_snapshots' })
@Index('ix_snapshot_flight_at', ['flightId', 'at'])
export class ForecastSnapshotEntity {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id!: string;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'datetime', precision: 3 })
  at!: Date;

  @Column({ type: 'double', name: 'p_oversale' })
  pOversale!: number;

  @Column({ type: 'double', name: 'expected_denied' })
  expectedDenied!: number;

  @Column({ type: 'int', name: 'checked_in' })
  checkedIn!: number;

  @Column({ type: 'int' })
  booked!: number;
}
