import { Column, Entity, Index, PrimaryColumn, PrimaryGeneratedColumn } from 'typeorm';
import type { Forecast } from '@shared/schemas/flight-desk';

/** The latest figures per flight, read by every console; replaced on each recompute. */
@Entity({ name: 'flight_forecasts' })
export class FlightForecastEntity {
  @PrimaryColumn({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'datetime', precision: 3, name: 'computed_at' })
  computedAt!: Date;

  @Column({ type: 'double', name: 'p_oversale' })
  pOversale!: number;

  @Column({ type: 'double', name: 'expected_denied' })
  expectedDenied!: number;

  @Column({ type: 'json' })
  forecast!: Forecast;

  /** Per-cabin figures and per-passenger probabilities with their reasons, as last computed. */
  @Column({ type: 'json' })
  detail!: object;
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
