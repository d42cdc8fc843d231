import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { UserEntity } from '../../db/entities';
import { decoyHash, verifyPassword } from './password';
import { presentSessionUser } from './session-user';

/** Returns the user when the e-mail and password match an active account; the same cost either way. */
export async function authenticate(db: DataSource, email: string, password: string): Promise<SessionUser | null> {
  const user = await db.getRepository(UserEntity).findOne({ where: { email: email.toLowerCase() }, relations: { stations: true } });
  const ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash()));
  return user && ok && user.active ? presentSessionUser(user) : null;
}
