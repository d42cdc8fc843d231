import { In, type DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { CreateUserBody, UpdateUserBody } from '@shared/schemas/users';
import { StationEntity, UserEntity } from '../../db/entities';
import { badRequest, conflict, notFound } from '../../http/errors';
import { audit } from '../audit/audit.service';
import { hashPassword } from '../auth/password';
import { adminHoldsStation, adminSharesStation, assertMayGrantStations } from './users.policy';
import { presentUser } from './users.presenter';

const isDuplicateKey = (err: unknown) => (err as { driverError?: { code?: string } })?.driverError?.code === 'ER_DUP_ENTRY';

export async function listUsers(db: DataSource, admin: SessionUser) {
  const all = await db.getRepository(UserEntity).find({ relations: { stations: true }, order: { displayName: 'ASC' } });
  return all.filter((u) => adminSharesStation(admin, u));
}

async function loadStations(db: DataSource, ids: number[]) {
  const stations = await db.getRepository(StationEntity).findBy({ id: In(ids) });
  if (stations.length !== new Set(ids).size) throw badRequest('stationIds: every station must exist', [{ field: 'stationIds', rule: 'every station must exist' }]);
  return stations;
}

export async function createUser(db: DataSource, admin: SessionUser, body: CreateUserBody) {
  assertMayGrantStations(admin, body.stationIds);
  const stations = await loadStations(db, body.stationIds);
  const passwordHash = await hashPassword(body.password);
  return db.transaction(async (em) => {
    const email = body.email.toLowerCase();
    if (await em.findOneBy(UserEntity, { email })) throw conflict('email_taken', 'A user with this e-mail already exists.');
    const user = em.create(UserEntity, { email, displayName: body.displayName, role: body.role, passwordHash, active: true, stations });
    // Two creates racing past the check above meet at the unique index: the loser is a conflict, not a failure.
    await em.save(user).catch((err: unknown) => {
      throw isDuplicateKey(err) ? conflict('email_taken', 'A user with this e-mail already exists.') : err;
    });
    const shown = presentUser(user);
    await audit(em, { actor: admin, action: 'user.created', entityType: 'user', entityId: user.id, after: shown });
    return shown;
  });
}

export async function updateUser(db: DataSource, admin: SessionUser, id: number, body: UpdateUserBody) {
  if (body.stationIds) assertMayGrantStations(admin, body.stationIds);
  if (id === admin.id && (body.active === false || (body.role && body.role !== 'admin'))) {
    throw badRequest('You cannot deactivate yourself or remove your own admin role.', [{ field: body.active === false ? 'active' : 'role', rule: 'an admin cannot lock themselves out' }]);
  }
  const stations = body.stationIds ? await loadStations(db, body.stationIds) : undefined;
  const passwordHash = body.password ? await hashPassword(body.password) : undefined;
  return db.transaction(async (em) => {
    // FOR UPDATE without an OF list: TypeORM accepts `tables` only on PostgreSQL and throws on MariaDB.
    const user = await em.findOne(UserEntity, { where: { id }, relations: { stations: true }, lock: { mode: 'pessimistic_write' } });
    if (!user || !adminSharesStation(admin, user)) throw notFound('User');
    const before = presentUser(user);
    if (body.displayName !== undefined) user.displayName = body.displayName;
    if (body.role !== undefined) user.role = body.role;
    if (body.active !== undefined) user.active = body.active;
    // Stations the admin does not hold stay as they are: granting is limited to the admin's stations, and so is taking away.
    if (stations) user.stations = [...stations, ...user.stations.filter((s) => !adminHoldsStation(admin, s.id))];
    if (passwordHash) user.passwordHash = passwordHash;
    await em.save(user);
    const after = presentUser(user);
    await audit(em, { actor: admin, action: body.active === false ? 'user.deactivated' : 'user.updated', entityType: 'user', entityId: id, before, after: { ...after, passwordChanged: Boolean(passwordHash) } });
    if (body.active === false || passwordHash) {
      // Ends every session of the user at once: deactivation or a new password must not wait for idle expiry.
      await em.query(`DELETE FROM sessions WHERE JSON_VALUE(data, '$.passport.user') = ?`, [id]);
    }
    return after;
  });
}
