import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { StationEntity } from './station.entity';

/**
 * A weekly pattern of one flight number from a station: on the chosen weekdays between two dates it flies at the
 * same local time. Saving it generates (or moves, or cancels) the dated flights it stands for.
 */
@Entity({ name: 'flight_schedules' })
@Index('ix_schedule_station', ['stationId', 'validFrom'])
export class FlightScheduleEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @ManyToOne(() => StationEntity, { nullable: false, onDelete: 'NO ACTION', onUpdate: 'NO ACTION' })
  @JoinColumn({ name: 'station_id', foreignKeyConstraintName: 'fk_schedule_station' })
  station!: Relation<StationEntity>;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'varchar', length: 3, name: 'carrier_code' })
  carrierCode!: string;

  @Column({ type: 'varchar', length: 5, name: 'flight_number' })
  flightNumber!: string;

  @Column({ type: 'char', length: 3 })
  destination!: string;

  /** Local wall-clock time at the station, "HH:mm": the same clock time in summer and winter. */
  @Column({ type: 'char', length: 5, name: 'departure_time' })
  departureTime!: string;

  @Column({ type: 'int', name: 'block_minutes' })
  blockMinutes!: number;

  @Column({ type: 'json', name: 'seats_by_cabin' })
  seatsByCabin!: Record<string, number>;

  @Column({ type: 'varchar', length: 8, name: 'aircraft_type', nullable: true })
  aircraftType!: string | null;

  /** ISO weekdays it flies on, 1 = Monday. */
  @Column({ type: 'json' })
  weekdays!: number[];

  @Column({ type: 'date', name: 'valid_from' })
  validFrom!: string;

  @Column({ type: 'date', name: 'valid_to' })
  validTo!: string;

  @Column({ type: 'boolean', default: false })
  cancelled!: boolean;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}
