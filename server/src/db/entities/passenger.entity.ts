import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { OptionalFee } from '@shared/schemas/optional-fees';
import { BookingEntity } from './booking.entity';

export type PassengerStatus = 'booked' | 'checked-in' | 'boarded' | 'offloaded' | 'cancelled';

@Entity({ name: 'passengers' })
@Index('ix_passenger_flight_status', ['flightId', 'status'])
export class PassengerEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @ManyToOne(() => BookingEntity, (b) => b.passengers, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'booking_id' })
  booking!: Relation<BookingEntity>;

  @Column({ type: 'int', name: 'booking_id' })
  bookingId!: number;

  /** Kept beside booking_id so per-flight counts need no join on the hot path. */
  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  /** The passenger's position in the PNR (1-based), stable across manifest re-imports. */
  @Column({ type: 'smallint', name: 'pnr_sequence' })
  pnrSequence!: number;

  @Column({ type: 'varchar', length: 60, name: 'first_name' })
  firstName!: string;

  @Column({ type: 'varchar', length: 60, name: 'last_name' })
  lastName!: string;

  @Column({ type: 'char', length: 1 })
  cabin!: string;

  @Column({ type: 'int', name: 'fare_minor' })
  fareMinor!: number;

  @Column({ type: 'char', length: 3, name: 'fare_currency' })
  fareCurrency!: string;

  @Column({ type: 'varchar', length: 16, name: 'fare_type', default: 'standard' })
  fareType!: string;

  /** IATA special-service request codes such as UMNR, WCHR, INFT. */
  @Column({ type: 'json', name: 'ssr_codes' })
  ssrCodes!: string[];

  /** Extras paid on top of the fare (seat selection, bags…), each in the fare's currency; refunded by some rules when not received. */
  @Column({ type: 'json', name: 'optional_fees', default: () => "'[]'" })
  optionalFees!: OptionalFee[];

  @Column({ type: 'varchar', length: 16, name: 'frequent_flyer_tier', nullable: true })
  frequentFlyerTier!: string | null;

  @Column({ type: 'boolean', name: 'is_child', default: false })
  isChild!: boolean;

  @Column({ type: 'varchar', length: 10, name: 'inbound_flight', nullable: true })
  inboundFlight!: string | null;

  @Column({ type: 'datetime', name: 'inbound_scheduled_arrival', nullable: true })
  inboundScheduledArrival!: Date | null;

  @Column({ type: 'datetime', name: 'inbound_estimated_arrival', nullable: true })
  inboundEstimatedArrival!: Date | null;

  @Column({ type: 'varchar', length: 4, nullable: true })
  seat!: string | null;

  @Column({ type: 'varchar', length: 16, default: 'booked' })
  status!: PassengerStatus;

  @Column({ type: 'datetime', precision: 3, name: 'checked_in_at', nullable: true })
  checkedInAt!: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'boarded_at', nullable: true })
  boardedAt!: Date | null;

  /** When the feed last changed this passenger's status: older events arriving late do not undo newer ones. */
  @Column({ type: 'datetime', precision: 3, name: 'status_changed_at', nullable: true })
  statusChangedAt!: Date | null;
}
