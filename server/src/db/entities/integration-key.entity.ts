import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A departure-control feed's credential for one station. Only a SHA-256 of the key is kept; the key is shown once. */
@Entity({ name: 'integration_keys' })
export class IntegrationKeyEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'varchar', length: 60 })
  name!: string;

  /** The first characters of the key, to recognise it in lists without revealing it. */
  @Column({ type: 'varchar', length: 16 })
  prefix!: string;

  @Column({ type: 'char', length: 64, name: 'key_hash', unique: true })
  keyHash!: string;

  @Column({ type: 'int', name: 'created_by_user_id', nullable: true })
  createdByUserId!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'revoked_at', nullable: true })
  revokedAt!: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'last_used_at', nullable: true })
  lastUsedAt!: Date | null;
}
