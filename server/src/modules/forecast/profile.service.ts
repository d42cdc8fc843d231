import type { DataSource, EntityManager } from 'typeorm';
import { DEFAULT_SHOW_UP_PROFILE, showUpProfileSchema, type ShowUpProfile } from '@shared/schemas/show-up-profile';
import { ShowUpProfileEntity } from '../../db/entities';

/** The station's profile, or the default until an admin sets one. */
export async function showUpProfileFor(db: DataSource | EntityManager, stationId: number): Promise<ShowUpProfile> {
  const row = await db.getRepository(ShowUpProfileEntity).findOneBy({ stationId });
  const parsed = row ? showUpProfileSchema.safeParse(row.profile) : null;
  return parsed?.success ? parsed.data : DEFAULT_SHOW_UP_PROFILE;
}
