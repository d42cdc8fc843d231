import { Column, CreateDateColumn, Entity, Index, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { VolunteerPolicy } from '@shared/schemas/volunteers';
import type { ApprovalKind } from '@shared/schemas/approvals';

/** A station's volunteer policy (offer ladder, agent limit, bid pricing), validated by the shared schema. */
@Entity({ name: 'volunteer_policies' })
export class VolunteerPolicyEntity {
  @PrimaryColumn({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'json' })
  policy!: VolunteerPolicy;

  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)', name: 'updated_at' })
  updatedAt!: Date;
}

/** One call for volunteers on a flight: a posted offer raised along the ladder, or sealed bids. */
@Entity({ name: 'volunteer_rounds' })
@Index('ix_round_flight', ['flightId', 'status'])
export class VolunteerRoundEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'varchar', length: 8 })
  kind!: 'posted' | 'sealed';

  @Column({ type: 'varchar', length: 12, default: 'open' })
  status!: 'open' | 'closed' | 'cancelled';

  @Column({ type: 'char', length: 3 })
  currency!: string;

  @Column({ type: 'int', name: 'offer_minor', nullable: true })
  offerMinor!: number | null;

  @Column({ type: 'json' })
  extras!: string[];

  @Column({ type: 'int', name: 'volunteers_needed' })
  volunteersNeeded!: number;

  @Column({ type: 'int', name: 'opened_by_user_id' })
  openedByUserId!: number;

  @Column({ type: 'varchar', length: 254, name: 'opened_by_label' })
  openedByLabel!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'opened_at' })
  openedAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'closed_at', nullable: true })
  closedAt!: Date | null;
}

/**
 * An amount above the requesting user's limit waits here for a supervisor of the station. The table kept its first
 * name (offer approvals); it now holds every kind. subjectId names the volunteer, compensation or denial the amount
 * belongs to; roundId the round for offers and sealed accepts.
 */
@Entity({ name: 'offer_approvals' })
export class OfferApprovalEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'varchar', length: 24, default: 'raise' })
  kind!: ApprovalKind;

  @Column({ type: 'int', name: 'round_id', nullable: true })
  roundId!: number | null;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'flight_id', nullable: true })
  flightId!: number | null;

  @Column({ type: 'int', name: 'subject_id', nullable: true })
  subjectId!: number | null;

  @Column({ type: 'int', name: 'offer_minor' })
  offerMinor!: number;

  @Column({ type: 'char', length: 3, nullable: true })
  currency!: string | null;

  /** The requester's limit when asking, so the queue can say by how much the amount is above it. */
  @Column({ type: 'int', name: 'limit_minor', nullable: true })
  limitMinor!: number | null;

  @Column({ type: 'varchar', length: 12, default: 'pending' })
  status!: 'pending' | 'approved' | 'rejected';

  @Column({ type: 'int', name: 'requested_by_user_id' })
  requestedByUserId!: number;

  @Column({ type: 'varchar', length: 254, name: 'requested_by_label' })
  requestedByLabel!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'requested_at' })
  requestedAt!: Date;

  @Column({ type: 'int', name: 'decided_by_user_id', nullable: true })
  decidedByUserId!: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'decided_at', nullable: true })
  decidedAt!: Date | null;

  @Column({ type: 'varchar', length: 200, default: '' })
  reason!: string;
}

/**
 * A booking that offered its seat in a round. One row per booking per round (unique), so the same party can never
 * be accepted twice; the round row is locked while accepting, so a round never takes more than it needs.
 */
@Entity({ name: 'volunteers' })
@Index('uq_volunteer_round_booking', ['roundId', 'bookingId'], { unique: true })
export class VolunteerEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'round_id' })
  roundId!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'booking_id' })
  bookingId!: number;

  @Column({ type: 'json', name: 'passenger_ids' })
  passengerIds!: number[];

  @Column({ type: 'int', name: 'ask_minor', nullable: true })
  askMinor!: number | null;

  @Column({ type: 'varchar', length: 16 })
  source!: 'passenger-link' | 'agent';

  @Column({ type: 'varchar', length: 12, default: 'offered' })
  status!: 'offered' | 'accepted' | 'declined' | 'withdrawn';

  @Column({ type: 'int', name: 'agreed_minor', nullable: true })
  agreedMinor!: number | null;

  @Column({ type: 'int', name: 'accepted_by_user_id', nullable: true })
  acceptedByUserId!: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'accepted_at', nullable: true })
  acceptedAt!: Date | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}

/** A seat held on the alternate flight for a volunteer (or, later, a denied passenger). */
@Entity({ name: 'rebookings' })
@Index('uq_rebooking_volunteer', ['volunteerId'], { unique: true })
export class RebookingEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'volunteer_id', nullable: true })
  volunteerId!: number | null;

  /** Set when the seat is held for a passenger denied boarding instead of a volunteer. */
  @Column({ type: 'int', name: 'denial_id', nullable: true })
  denialId!: number | null;

  @Column({ type: 'int', name: 'original_flight_id' })
  originalFlightId!: number;

  @Column({ type: 'int', name: 'alternate_flight_id', nullable: true })
  alternateFlightId!: number | null;

  /** Another carrier's flight entered by hand, e.g. "XY 204". */
  @Column({ type: 'varchar', length: 20 })
  label!: string;

  @Column({ type: 'datetime', name: 'departure' })
  departure!: Date;

  @Column({ type: 'datetime', name: 'arrival' })
  arrival!: Date;

  @Column({ type: 'int', name: 'planned_arrival_delay_minutes' })
  plannedArrivalDelayMinutes!: number;

  @Column({ type: 'smallint', name: 'seats' })
  seats!: number;

  @Column({ type: 'int', name: 'created_by_user_id' })
  createdByUserId!: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}
