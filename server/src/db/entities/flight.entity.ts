import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { FlightState } from '@shared/schemas/flights';
import type { CommonShock } from '@shared/forecast';
import { StationEntity } from './station.entity';
import { FlightScheduleEntity } from './flight-schedule.entity';

@Entity({ name: 'flights' })
@Index('uq_flight_service', ['carrierCode', 'flightNumber', 'serviceDate', 'origin'], { unique: true })
export class FlightEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  /** The departure station: who may see and work this flight. */
  @ManyToOne(() => StationEntity, { nullable: false })
  @JoinColumn({ name: 'station_id' })
  station!: Relation<StationEntity>;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'varchar', length: 3, name: 'carrier_code' })
  carrierCode!: string;

  @Column({ type: 'varchar', length: 5, name: 'flight_number' })
  flightNumber!: string;

  /** The local calendar date of departure at the origin, as the trade names a flight. */
  @Column({ type: 'date', name: 'service_date' })
  serviceDate!: string;

  @Column({ type: 'char', length: 3 })
  origin!: string;

  @Column({ type: 'char', length: 3 })
  destination!: string;

  @Column({ type: 'datetime', name: 'scheduled_departure' })
  scheduledDeparture!: Date;

  @Column({ type: 'datetime', name: 'scheduled_arrival' })
  scheduledArrival!: Date;

  @Column({ type: 'varchar', length: 8, name: 'aircraft_type', nullable: true })
  aircraftType!: string | null;

  /** Physical seats per cabin letter, e.g. { "J": 16, "Y": 150 }. */
  @Column({ type: 'json', name: 'seats_by_cabin' })
  seatsByCabin!: Record<string, number>;

  @Column({ type: 'varchar', length: 8, nullable: true })
  gate!: string | null;

  @Column({ type: 'varchar', length: 16, default: 'scheduled' })
  state!: FlightState;

  /** A common shock for disruption days (weather, a late bank of connections), set by a supervisor with a reason. */
  @Column({ type: 'json', nullable: true })
  shock!: CommonShock | null;

  /** The weekly schedule that generated this flight; null for flights from the feed, a manifest or the demo. */
  @ManyToOne(() => FlightScheduleEntity, { nullable: true, onDelete: 'SET NULL', onUpdate: 'NO ACTION' })
  @JoinColumn({ name: 'schedule_id', foreignKeyConstraintName: 'fk_flight_schedule' })
  schedule!: Relation<FlightScheduleEntity> | null;

  @Column({ type: 'int', name: 'schedule_id', nullable: true })
  scheduleId!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}
