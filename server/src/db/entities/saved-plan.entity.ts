import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { PlannerInput } from '@shared/schemas/planner';
import type { PlanResult } from '@shared/schemas/plans';
import { StationEntity } from './station.entity';
import { UserEntity } from './user.entity';

/** A booking-limit plan a supervisor or admin kept for a route or a future flight of their station. */
@Entity({ name: 'saved_plans' })
@Index('ix_saved_plan_route', ['stationId', 'routeKey', 'createdAt'])
export class SavedPlanEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @ManyToOne(() => StationEntity, { nullable: false })
  @JoinColumn({ name: 'station_id' })
  station!: Relation<StationEntity>;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  /** "BOS-ORD" for a route, "BOS-ORD/BB123/2026-06-01" for one flight on it. */
  @Column({ type: 'varchar', length: 32, name: 'route_key' })
  routeKey!: string;

  @Column({ type: 'varchar', length: 100 })
  name!: string;

  /** The planner inputs exactly as validated, so the plan can be reopened and recomputed. */
  @Column({ type: 'json' })
  inputs!: PlannerInput;

  /** The optimum computed on the server at save time, money in minor units of inputs.currency. */
  @Column({ type: 'json' })
  result!: PlanResult;

  @ManyToOne(() => UserEntity, { nullable: false })
  @JoinColumn({ name: 'created_by_user_id' })
  createdBy!: Relation<UserEntity>;

  @Column({ type: 'int', name: 'created_by_user_id' })
  createdByUserId!: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;
}
