import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * A passenger accommodated in another cabin than the one booked (an upgrade or a downgrade), recorded at the desk
 * with the fare difference and what the station's rule says is owed for it. Counted on the period report.
 */
@Entity({ name: 'cabin_changes' })
@Index('uq_cabin_change_passenger', ['flightId', 'passengerId'], { unique: true })
@Index('ix_cabin_change_station', ['stationId'])
export class CabinChangeEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'passenger_id' })
  passengerId!: number;

  @Column({ type: 'varchar', length: 4, name: 'booked_cabin' })
  bookedCabin!: string;

  @Column({ type: 'varchar', length: 4, name: 'flown_cabin' })
  flownCabin!: string;

  @Column({ type: 'varchar', length: 10 })
  direction!: 'upgrade' | 'downgrade';

  /** Fare of the cabin booked minus the fare of the cabin flown, in minor units: positive for a downgrade. */
  @Column({ type: 'int', name: 'fare_difference_minor' })
  fareDifferenceMinor!: number;

  @Column({ type: 'char', length: 3 })
  currency!: string;

  @Column({ type: 'varchar', length: 16 })
  regime!: string;

  /** What the station's rule says the passenger is owed back for a downgrade (0 for an upgrade). */
  @Column({ type: 'int', name: 'owed_minor' })
  owedMinor!: number;

  @Column({ type: 'varchar', length: 200, name: 'owed_rule' })
  owedRule!: string;

  @Column({ type: 'varchar', length: 200 })
  reason!: string;

  @Column({ type: 'int', name: 'recorded_by_user_id' })
  recordedByUserId!: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}
