import { Column, CreateDateColumn, Entity, Index, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { CareKind, ChoiceKind } from '@shared/compensation';

export interface StoredPartnerHotel {
  id: string;
  name: string;
  address: string;
  phone: string;
  nightlyRateMinor: number;
}

/** A station's meal allowances (in the station's currency) and its partner hotels for denied passengers who wait. */
@Entity({ name: 'station_care_settings' })
export class StationCareSettingsEntity {
  @PrimaryColumn({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'refreshment_minor' })
  refreshmentMinor!: number;

  @Column({ type: 'int', name: 'meal_minor' })
  mealMinor!: number;

  @Column({ type: 'json' })
  hotels!: StoredPartnerHotel[];

  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)', name: 'updated_at' })
  updatedAt!: Date;
}

/** The passenger's choice (refund or re-routing), once per compensation: the passenger it belongs to. */
@Entity({ name: 'passenger_choices' })
@Index('uq_passenger_choice_compensation', ['compensationId'], { unique: true })
export class PassengerChoiceEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'compensation_id' })
  compensationId!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'passenger_id' })
  passengerId!: number;

  @Column({ type: 'varchar', length: 20 })
  kind!: ChoiceKind;

  @Column({ type: 'varchar', length: 300, default: '' })
  note!: string;

  @Column({ type: 'int', name: 'recorded_by_user_id' })
  recordedByUserId!: number;

  @Column({ type: 'varchar', length: 254, name: 'recorded_by_label' })
  recordedByLabel!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'recorded_at' })
  recordedAt!: Date;
}

/** A ticket refund the passenger chose, recorded as owed; the payments side pays it and moves its state on. */
@Entity({ name: 'ticket_refunds' })
@Index('uq_ticket_refund_compensation', ['compensationId'], { unique: true })
@Index('ix_ticket_refund_station_state', ['stationId', 'state'])
export class TicketRefundEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'compensation_id' })
  compensationId!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'passenger_id' })
  passengerId!: number;

  /** The fare paid for this flight, the part of the ticket not flown. */
  @Column({ type: 'int', name: 'amount_minor' })
  amountMinor!: number;

  @Column({ type: 'char', length: 3 })
  currency!: string;

  @Column({ type: 'boolean', name: 'return_flight_owed' })
  returnFlightOwed!: boolean;

  @Column({ type: 'varchar', length: 12, default: 'owed' })
  state!: 'owed' | 'paid';

  @Column({ type: 'varchar', length: 120, name: 'rule_ref' })
  ruleRef!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}

/** Care handed over or booked for a waiting passenger, with its cost: care costs, kept apart from compensation. */
@Entity({ name: 'care_given' })
@Index('ix_care_given_compensation', ['compensationId'])
@Index('ix_care_given_station_recorded', ['stationId', 'recordedAt'])
export class CareGivenEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'compensation_id' })
  compensationId!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'int', name: 'flight_id' })
  flightId!: number;

  @Column({ type: 'int', name: 'passenger_id' })
  passengerId!: number;

  @Column({ type: 'varchar', length: 16 })
  kind!: CareKind;

  @Column({ type: 'varchar', length: 200 })
  description!: string;

  @Column({ type: 'int', name: 'amount_minor', nullable: true })
  amountMinor!: number | null;

  @Column({ type: 'char', length: 3, nullable: true })
  currency!: string | null;

  @Column({ type: 'varchar', length: 24, name: 'hotel_id', nullable: true })
  hotelId!: string | null;

  /** The hotel's name as it was when booked: the station's list may change later. */
  @Column({ type: 'varchar', length: 120, name: 'hotel_name', nullable: true })
  hotelName!: string | null;

  @Column({ type: 'varchar', length: 120, name: 'provided_by' })
  providedBy!: string;

  @Column({ type: 'int', name: 'recorded_by_user_id' })
  recordedByUserId!: number;

  @Column({ type: 'varchar', length: 254, name: 'recorded_by_label' })
  recordedByLabel!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'recorded_at' })
  recordedAt!: Date;
}
