import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { RegimeCode } from '@shared/schemas/common';

@Entity({ name: 'stations' })
export class StationEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'char', length: 3, unique: true })
  iata!: string;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  /** IANA zone: times are stored in UTC and shown in this zone. */
  @Column({ type: 'varchar', length: 64, name: 'time_zone' })
  timeZone!: string;

  @Column({ type: 'varchar', length: 16 })
  regime!: RegimeCode;

  @Column({ type: 'char', length: 3 })
  currency!: string;

  /** The station's tolerated chance of still being oversold after volunteers, in basis points (500 = 5 %). */
  @Column({ type: 'int', name: 'risk_tolerance_bp', default: 500 })
  riskToleranceBp!: number;

  /**
   * Minutes after the scheduled departure after which the flight counts as gone even if no one marked it departed
   * (a station setting; 10 by default, matching the clock that moves states along).
   */
  @Column({ type: 'int', name: 'departure_grace_minutes', default: 10 })
  departureGraceMinutes!: number;

  /** Bookings per flight may not exceed capacity times this factor, in basis points (15000 = 1.5 x). */
  @Column({ type: 'int', name: 'max_overbooking_bp', default: 15_000 })
  maxOverbookingBp!: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}
