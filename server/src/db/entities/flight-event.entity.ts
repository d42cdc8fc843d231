import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** Every event the feed sent, applied or not: the unique index makes a repeated id a no-op. */
@Entity({ name: 'flight_events' })
@Index('uq_flight_event_station_event', ['stationId', 'eventId'], { unique: true })
@Index('ix_flight_event_flight', ['flightId', 'receivedAt'])
export class FlightEventEntity {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id!: string;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'varchar', length: 64, name: 'event_id' })
  eventId!: string;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'varchar', length: 32 })
  type!: string;

  @Column({ type: 'datetime', precision: 3, name: 'occurred_at' })
  occurredAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'received_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  receivedAt!: Date;

  /** applied, or superseded (older than what is already known for that passenger). */
  @Column({ type: 'varchar', length: 16 })
  status!: string;

  @Column({ type: 'varchar', length: 200 })
  summary!: string;

  @Column({ type: 'json' })
  payload!: object;
}
