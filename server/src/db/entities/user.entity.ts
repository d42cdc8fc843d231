import { Column, CreateDateColumn, Entity, JoinTable, ManyToMany, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { Role } from '@shared/schemas/common';
import { StationEntity } from './station.entity';

@Entity({ name: 'users' })
export class UserEntity {
  @PrimaryGeneratedColumn({ type: 'int' })
  id!: number;

  @Column({ type: 'varchar', length: 254, unique: true })
  email!: string;

  @Column({ type: 'varchar', length: 100, name: 'display_name' })
  displayName!: string;

  @Column({ type: 'varchar', length: 255, name: 'password_hash' })
  passwordHash!: string;

  @Column({ type: 'varchar', length: 16 })
  role!: Role;

  @Column({ type: 'boolean', default: true })
  active!: boolean;

  /** An admin who manages every user of the carrier; without it an admin manages only users wholly inside their stations. */
  @Column({ type: 'boolean', name: 'carrier_wide', default: false })
  carrierWide!: boolean;

  @ManyToMany(() => StationEntity)
  @JoinTable({ name: 'user_stations', joinColumn: { name: 'user_id' }, inverseJoinColumn: { name: 'station_id' } })
  stations!: Relation<StationEntity[]>;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)', name: 'updated_at' })
  updatedAt!: Date;
}
