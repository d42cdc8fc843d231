import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';
import type { ShowUpProfile } from '@shared/schemas/show-up-profile';

/** One per station; validated against the shared schema on every write. */
@Entity({ name: 'show_up_profiles' })
export class ShowUpProfileEntity {
  @PrimaryColumn({ type: 'int', name: 'station_id' })
  stationId!: number;

  @Column({ type: 'json' })
  profile!: ShowUpProfile;

  @Column({ type: 'int', name: 'updated_by_user_id', nullable: true })
  updatedByUserId!: number | null;

  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)', name: 'updated_at' })
  updatedAt!: Date;
}
