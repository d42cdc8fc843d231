import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { UserEntity } from '../../db/entities';
import { unauthenticated } from '../../domain/errors';
import { decoyHash, verifyPassword } from './password';
import { presentSessionUser } from './session-user';
import type { SignInThrottle } from './throttle';

/** Returns the user when the e-mail and password match an active account; the same cost either way. */
export async function authenticate(db: DataSource, email: string, password: string): Promise<SessionUser | null> {
  const user = await db.getRepository(UserEntity).findOne({ where: { email: email.toLowerCase() }, relations: { stations: true } });
  const ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash()));
  return user && ok && user.active ? presentSessionUser(user) : null;
}

/** A failed sign-in counts against the throttle, and gets one answer for an unknown e-mail and a wrong password alike. */
export async function refuseSignIn(throttle: SignInThrottle, email: string, ip: string): Promise<never> {
  await throttle.recordFailure(email, ip);
  // Never reveal which accounts exist.
  throw unauthenticated('sign_in_failed', 'That e-mail and password do not match an active account.');
}
