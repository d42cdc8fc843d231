import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { JourneySegment } from '@shared/compensation';
import type { Language } from '@shared/i18n';
import type { BookingChannel } from '@shared/schemas/booking-channel';
import { FlightEntity } from './flight.entity';
import { PassengerEntity } from './passenger.entity';

/** One PNR on one flight: the party that was booked together. */
@Entity({ name: 'bookings' })
@Index('uq_booking_flight_pnr', ['flightId', 'pnr'], { unique: true })
export class BookingEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @ManyToOne(() => FlightEntity, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'flight_id' })
  flight!: Relation<FlightEntity>;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'varchar', length: 8 })
  pnr!: string;

  @Column({ type: 'varchar', length: 254, name: 'contact_email', nullable: true })
  contactEmail!: string | null;

  /** The language the party reads notices and statements in; null when the booking system did not say. */
  @Column({ type: 'varchar', length: 5, nullable: true, default: null })
  language!: Language | null;

  /** Where the booking was made; null when the booking system did not say. */
  @Column({ type: 'varchar', length: 16, nullable: true, default: null })
  channel!: BookingChannel | null;

  /** Whether the party must travel (and show) together; a party may choose to split at the gate. */
  @Column({ type: 'boolean', name: 'travels_together', default: true })
  travelsTogether!: boolean;

  /** The flights after this one to the final destination on the ticket; empty or null when this flight ends the journey. */
  @Column({ type: 'json', nullable: true })
  itinerary!: JourneySegment[] | null;

  @Column({ type: 'varchar', length: 16, default: 'active' })
  status!: 'active' | 'cancelled';

  @OneToMany(() => PassengerEntity, (p) => p.booking)
  passengers!: Relation<PassengerEntity[]>;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}
