// Shared fixtures for the API tests: unique rows in the shared test database, session-cookie reading, sign-in
// attempts from a chosen client address.
import { randomBytes } from 'node:crypto';
import type { Response } from 'supertest';
import { In, type DataSource } from 'typeorm';
import type { Role } from '@shared/schemas/common';
import { StationEntity, UserEntity } from '../../server/src/db/entities';
import { hashPassword } from '../../server/src/modules/auth/password';
import type { Client } from './harness';

/** Marks every row this run creates, so parallel runs on the shared database never collide and cleanup is exact. */
export const RUN_ID = `${Date.now().toString(36)}${randomBytes(3).toString('hex')}`;
let sequence = 0;

/** `.test` is a reserved top-level domain (RFC 2606), so these addresses can never reach a real mailbox. */
export function uniqueEmail(label: string): string {
  sequence += 1;
  return `api-${label}-${RUN_ID}-${sequence}@bumpboard.test`;
}

/** At least 12 characters, the length the user schema demands (OWASP Authentication Cheat Sheet, from memory). */
export const TEST_PASSWORD = 'gate-day-test-password-42';

export const DEMO = {
  agent: 'agent@bumpboard.test',
  supervisor: 'supervisor@bumpboard.test',
  finance: 'finance@bumpboard.test',
  admin: 'admin@bumpboard.test',
} as const satisfies Record<Role, string>;

export async function stationIdByIata(db: DataSource, iata: string): Promise<number> {
  const station = await db.getRepository(StationEntity).findOneByOrFail({ iata });
  return station.id;
}

/**
 * A station none of the demo users belong to. Fixed code, created once and reused by later runs, so the shared
 * database does not fill with stations. Tromsø: a real airport in Norway, where EU 261/2004 applies through the EEA.
 */
export async function foreignStation(db: DataSource): Promise<StationEntity> {
  const repo = db.getRepository(StationEntity);
  const existing = await repo.findOneBy({ iata: 'TOS' });
  const station =
    existing ??
    (await repo.save(repo.create({ iata: 'TOS', name: 'Tromsø (API test station)', timeZone: 'Europe/Oslo', regime: 'eu-261', currency: 'NOK' })));
  const [{ members }] = await db.query(
    `SELECT COUNT(*) AS members FROM user_stations us JOIN users u ON u.id = us.user_id WHERE us.station_id = ? AND u.email IN (?)`,
    [station.id, Object.values(DEMO)],
  );
  if (Number(members) !== 0) throw new Error('A demo user belongs to station TOS; the "other station" cases would prove nothing.');
  return station;
}

/** Inserts a user straight into the database, bypassing the users API under test. */
export async function insertUser(db: DataSource, opts: { label: string; role: Role; stationIds: number[]; password?: string }): Promise<UserEntity> {
  const repo = db.getRepository(UserEntity);
  const stations = await db.getRepository(StationEntity).findBy({ id: In(opts.stationIds) });
  const user = repo.create({
    email: uniqueEmail(opts.label),
    displayName: `API test ${opts.label}`,
    role: opts.role,
    passwordHash: await hashPassword(opts.password ?? TEST_PASSWORD),
    active: true,
    stations,
  });
  return repo.save(user);
}

/**
 * Removes the users this run created (their station links cascade). A user who did something that is on record
 * (opened a round, created a key) stays, deactivated: the foreign keys keep every record's author, as in production,
 * where users are deactivated and never deleted. Audit rows stay too, as the log is append-only.
 */
export async function removeRunUsers(db: DataSource): Promise<void> {
  const users: { id: number }[] = await db.query(`SELECT id FROM users WHERE email LIKE ?`, [`%-${RUN_ID}-%`]);
  for (const { id } of users) {
    try {
      await db.query('DELETE FROM users WHERE id = ?', [id]);
    } catch (err) {
      if ((err as { driverError?: { code?: string } }).driverError?.code !== 'ER_ROW_IS_REFERENCED_2') throw err;
      await db.query('UPDATE users SET active = 0 WHERE id = ?', [id]);
    }
  }
}

export function sessionCookie(res: Response): string | undefined {
  const header = res.headers['set-cookie'] as unknown as string[] | undefined;
  return header?.find((c) => c.startsWith('bumpboard.sid='));
}

/** The store's session id inside the signed cookie value `s:<id>.<signature>`. */
export function sessionIdFrom(res: Response): string {
  const cookie = sessionCookie(res);
  if (!cookie) throw new Error('the response set no session cookie');
  const value = decodeURIComponent(cookie.split(';')[0].slice('bumpboard.sid='.length));
  return value.slice(2, value.lastIndexOf('.'));
}

/**
 * A sign-in as if from `address`: the app trusts X-Forwarded-For from a loopback proxy, and the test client
 * connects over loopback, so each test can stand for a different client address.
 */
export async function signInFrom(c: Client, email: string, password: string, address: string): Promise<Response> {
  await c.refreshCsrf();
  return c.agent.post('/api/auth/sign-in').set('X-CSRF-Token', c.csrf).set('X-Forwarded-For', address).send({ email, password });
}

export async function sessionRowsOf(db: DataSource, userId: number): Promise<number> {
  const [{ n }] = await db.query(`SELECT COUNT(*) AS n FROM sessions WHERE JSON_VALUE(data, '$.passport.user') = ?`, [userId]);
  return Number(n);
}
