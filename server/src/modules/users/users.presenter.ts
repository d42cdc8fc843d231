import type { User } from '@shared/schemas/users';
import type { UserEntity } from '../../db/entities';
import { presentSessionUser } from '../auth/session-user';

export function presentUser(u: UserEntity): User {
  const { stations } = presentSessionUser(u);
  return { id: u.id, email: u.email, displayName: u.displayName, role: u.role, active: u.active, stations, createdAt: u.createdAt.toISOString() };
}
