import { Column, CreateDateColumn, Entity, Index, PrimaryColumn, PrimaryGeneratedColumn } from 'typeorm';

export type BookingOutcome = 'showed' | 'no-show' | 'volunteered' | 'denied' | 'missed-connection';

/**
 * A flight as it closed, kept for learning. `flightId` is a plain number, not a foreign key: the history outlives the
 * operational flight rows (the demo replaces those every day).
 */
@Entity({ name: 'closed_flights' })
@Index('ix_closed_flight_station_departure', ['stationId', 'scheduledDeparture'])
export class ClosedFlightEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Index('uq_closed_flight_flight', { unique: true })
  @Column({ type: 'int', name: 'flight_id', nullable: true })
  flightId!: number | null;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'varchar', length: 3, name: 'carrier_code' })
  carrierCode!: string;

  @Column({ type: 'varchar', length: 5, name: 'flight_number' })
  flightNumber!: string;

  @Column({ type: 'date', name: 'service_date' })
  serviceDate!: string;

  @Column({ type: 'char', length: 3 })
  origin!: string;

  @Column({ type: 'char', length: 3 })
  destination!: string;

  @Column({ type: 'datetime', name: 'scheduled_departure' })
  scheduledDeparture!: Date;

  /** 0 = Sunday … 6 = Saturday, in the station's own zone. */
  @Column({ type: 'tinyint', name: 'day_of_week' })
  dayOfWeek!: number;

  @Column({ type: 'json', name: 'seats_by_cabin' })
  seatsByCabin!: Record<string, number>;

  /** Invented history loaded with the demo, generated from known rates. */
  @Column({ type: 'boolean', default: false })
  demo!: boolean;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'closed_at' })
  closedAt!: Date;
}

/** One booked passenger's outcome at a closed flight, with what was known at set times before departure. */
@Entity({ name: 'booking_outcomes' })
@Index('ix_outcome_closed_flight', ['closedFlightId'])
export class BookingOutcomeEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'closed_flight_id' })
  closedFlightId!: number;

  @Column({ type: 'int', name: 'passenger_id', nullable: true })
  passengerId!: number | null;

  @Column({ type: 'varchar', length: 8 })
  pnr!: string;

  @Column({ type: 'char', length: 1 })
  cabin!: string;

  @Column({ type: 'varchar', length: 16, name: 'fare_class' })
  fareClass!: string;

  @Column({ type: 'varchar', length: 16, default: 'unknown' })
  channel!: string;

  @Column({ type: 'boolean' })
  connecting!: boolean;

  @Column({ type: 'smallint', name: 'party_size' })
  partySize!: number;

  @Column({ type: 'datetime', precision: 3, name: 'checked_in_at', nullable: true })
  checkedInAt!: Date | null;

  @Column({ type: 'boolean', name: 'checked_in_t24' })
  checkedInT24!: boolean;

  @Column({ type: 'boolean', name: 'checked_in_t3' })
  checkedInT3!: boolean;

  @Column({ type: 'boolean', name: 'checked_in_t1' })
  checkedInT1!: boolean;

  @Column({ type: 'varchar', length: 20 })
  outcome!: BookingOutcome;

  /** Set when a supervisor corrected the outcome (the audit row holds who and what it was before). */
  @Column({ type: 'datetime', precision: 3, name: 'corrected_at', nullable: true })
  correctedAt!: Date | null;
}

export type LearningJobStatus = 'queued' | 'running' | 'done' | 'failed';

/** A training run. At most one is queued or running: the unique generated `active` column enforces it. */
@Entity({ name: 'learning_jobs' })
export class LearningJobEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'varchar', length: 10 })
  status!: LearningJobStatus;

  @Column({ type: 'varchar', length: 10, name: 'trigger_kind' })
  trigger!: 'on-demand' | 'nightly';

  @Column({ type: 'int', name: 'requested_by_user_id', nullable: true })
  requestedByUserId!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'requested_at' })
  requestedAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'started_at', nullable: true })
  startedAt!: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'finished_at', nullable: true })
  finishedAt!: Date | null;

  /** 0-100. */
  @Column({ type: 'tinyint', unsigned: true, default: 0 })
  progress!: number;

  @Column({ type: 'varchar', length: 80, default: '' })
  stage!: string;

  @Column({ type: 'varchar', length: 500, nullable: true })
  error!: string | null;

  @Column({ type: 'int', name: 'rates_version', nullable: true })
  ratesVersion!: number | null;

  /** Requests that joined this run while it was queued or running. */
  @Column({ type: 'int', default: 1 })
  requests!: number;
}

/** One version of the learned rates, with its calibration on the flights held out of training. */
@Entity({ name: 'learned_rates' })
export class LearnedRatesEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  version!: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;

  @Column({ type: 'int', name: 'job_id' })
  jobId!: number;

  @Column({ type: 'int', name: 'flights_trained' })
  flightsTrained!: number;

  @Column({ type: 'int', name: 'flights_held_out' })
  flightsHeldOut!: number;

  /** Per station and route: the profile the forecast uses, and the common shock. */
  @Column({ type: 'json' })
  model!: object;

  /** Per station and route: scores, reliability bins and the oversale backtest. */
  @Column({ type: 'json' })
  calibration!: object;
}

/** Which rates a station's forecasts use: the learned ones (latest or a pinned version) or the hand-set profile. */
@Entity({ name: 'station_rates_choice' })
export class StationRatesChoiceEntity {
  @PrimaryColumn({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'varchar', length: 10 })
  mode!: 'learned' | 'hand-set';

  @Column({ type: 'int', name: 'pinned_version', nullable: true })
  pinnedVersion!: number | null;

  @Column({ type: 'int', name: 'updated_by_user_id', nullable: true })
  updatedByUserId!: number | null;
}
