import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { UserEntity } from '../../db/entities';

export function presentSessionUser(u: UserEntity): SessionUser {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    role: u.role,
    stations: [...(u.stations ?? [])].sort((a, b) => a.iata.localeCompare(b.iata)).map((s) => ({ id: s.id, iata: s.iata, name: s.name, timeZone: s.timeZone })),
  };
}

/**
 * Reloaded on every request so a role change or deactivation takes effect at once. `find`, not `findOne`: with a
 * relation joined, findOne's implied LIMIT 1 makes TypeORM read the user twice (first the distinct ids, then the rows).
 */
export async function loadActiveSessionUser(db: DataSource, id: number): Promise<SessionUser | null> {
  const [u] = await db.getRepository(UserEntity).find({ where: { id }, relations: { stations: true } });
  return u && u.active ? presentSessionUser(u) : null;
}
