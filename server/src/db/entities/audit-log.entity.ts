import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** Append-only: database triggers refuse UPDATE and DELETE on this table. */
@Entity({ name: 'audit_log' })
@Index('ix_audit_entity', ['entityType', 'entityId'])
export class AuditLogEntity {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  at!: Date;

  @Column({ type: 'int', name: 'actor_user_id', nullable: true })
  actorUserId!: number | null;

  /** Who acted, in words that stay readable after the user is gone: an e-mail, "integration key 3", "system". */
  @Column({ type: 'varchar', length: 254, name: 'actor_label' })
  actorLabel!: string;

  @Column({ type: 'varchar', length: 64 })
  action!: string;

  @Column({ type: 'varchar', length: 32, name: 'entity_type' })
  entityType!: string;

  @Column({ type: 'varchar', length: 64, name: 'entity_id' })
  entityId!: string;

  @Column({ type: 'int', name: 'station_id', nullable: true })
  stationId!: number | null;

  @Column({ type: 'json', nullable: true })
  before!: object | null;

  @Column({ type: 'json', nullable: true })
  after!: object | null;
}
