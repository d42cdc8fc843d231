import { Column, CreateDateColumn, Entity, Index, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { PriorityRule } from '@shared/denial';
import type { DenialCategory, DenialCompensationSnapshot } from '@shared/schemas/denials';

/** A station's boarding-priority rules for involuntary denial, and its frequent-flyer tiers from lowest to highest. */
@Entity({ name: 'station_priority_rules' })
export class StationPriorityRulesEntity {
  @PrimaryColumn({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'json' })
  rules!: PriorityRule[];

  @Column({ type: 'json', name: 'tier_order' })
  tierOrder!: string[];

  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)', name: 'updated_at' })
  updatedAt!: Date;
}

export type DenialProposalStatus = 'proposed' | 'authorized' | 'changed' | 'withdrawn';

/** An agent's (or supervisor's) proposal to deny boarding on a flight, waiting for a supervisor who did not make it. */
@Entity({ name: 'denial_proposals' })
@Index('ix_denial_proposal_flight', ['flightId', 'status'])
@Index('ix_denial_proposal_station', ['stationId', 'status'])
export class DenialProposalEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'varchar', length: 12, default: 'proposed' })
  status!: DenialProposalStatus;

  @Column({ type: 'int', name: 'seats_needed' })
  seatsNeeded!: number;

  @Column({ type: 'int', name: 'proposed_by_user_id' })
  proposedByUserId!: number;

  @Column({ type: 'varchar', length: 254, name: 'proposed_by_label' })
  proposedByLabel!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'proposed_at' })
  proposedAt!: Date;

  @Column({ type: 'int', name: 'decided_by_user_id', nullable: true })
  decidedByUserId!: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'decided_at', nullable: true })
  decidedAt!: Date | null;

  /** Why the proposer needs the seats (e.g. "2 short after the volunteer round closed"). */
  @Column({ type: 'varchar', length: 300 })
  reason!: string;
}

export type DenialStatus = 'proposed' | 'authorized' | 'removed';

/** One unit (a party kept together, or one traveller) selected for involuntary denial within a proposal. */
@Entity({ name: 'denials' })
@Index('ix_denial_flight', ['flightId', 'status'])
@Index('ix_denial_proposal', ['proposalId'])
export class DenialEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'proposal_id' })
  proposalId!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'booking_id' })
  bookingId!: number;

  @Column({ type: 'json', name: 'passenger_ids' })
  passengerIds!: number[];

  /** Rank position when selected (1 = selected first). */
  @Column({ type: 'int' })
  position!: number;

  /** The ranking's plain words for why this unit stands where it does. */
  @Column({ type: 'json' })
  reasons!: string[];

  @Column({ type: 'varchar', length: 12, default: 'proposed' })
  status!: DenialStatus;

  /** Who put this unit in the selection: the proposer, or the supervisor who added it. Never its authorizer. */
  @Column({ type: 'int', name: 'selected_by_user_id' })
  selectedByUserId!: number;

  @Column({ type: 'int', name: 'authorized_by_user_id', nullable: true })
  authorizedByUserId!: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'authorized_at', nullable: true })
  authorizedAt!: Date | null;

  @Column({ type: 'varchar', length: 300, name: 'change_reason', nullable: true })
  changeReason!: string | null;

  /** Classification for the denied-boarding report, set once the compensation is fixed. */
  @Column({ type: 'varchar', length: 4, nullable: true })
  category!: DenialCategory | null;

  /** What each passenger is owed, frozen when the rebooking fixed the planned arrival delay. */
  @Column({ type: 'json', nullable: true })
  compensation!: DenialCompensationSnapshot | null;

  /** Outbox ids of the written statements, one per passenger who has an e-mail address. */
  @Column({ type: 'json', name: 'statement_message_ids', nullable: true })
  statementMessageIds!: string[] | null;

  /** Set only for a denial recorded after the fact: when it really happened (its date chooses the amounts in force). */
  @Column({ type: 'datetime', precision: 3, name: 'occurred_at', nullable: true })
  occurredAt!: Date | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}

export type RefusalGround = 'safety' | 'security' | 'health' | 'conduct';

/**
 * A refusal of carriage for safety, security, health or the passenger's conduct: not a denial of boarding, no
 * compensation, never counted on the denied-boarding report.
 */
@Entity({ name: 'boarding_refusals' })
@Index('ix_boarding_refusal_flight', ['flightId'])
export class BoardingRefusalEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'booking_id' })
  bookingId!: number;

  @Column({ type: 'json', name: 'passenger_ids' })
  passengerIds!: number[];

  @Column({ type: 'varchar', length: 12 })
  ground!: RefusalGround;

  @Column({ type: 'varchar', length: 300 })
  reason!: string;

  @Column({ type: 'int', name: 'refused_by_user_id' })
  refusedByUserId!: number;

  @Column({ type: 'varchar', length: 254, name: 'refused_by_label' })
  refusedByLabel!: string;

  @Column({ type: 'datetime', precision: 3, name: 'refused_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  refusedAt!: Date;
}
