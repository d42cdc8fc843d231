import { In, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { CreateUserBody, UpdateUserBody, UserList } from '@shared/schemas/users';
import { StationEntity, UserEntity } from '../../db/entities';
import { badRequest, conflict, unauthenticated } from '../../domain/errors';
import { audit } from '../audit/audit.service';
import { hashPassword } from '../auth/password';
import { assertMayGrantCarrierWide, assertMayGrantStations, assertMayManage, scopeOf, seesUser, type AdminScope } from './users.policy';
import { presentUser } from './users.presenter';
import { isDuplicateKey } from '../../db/driver-errors';


/** The acting admin's reach, read from their own row so a grant or a removal counts from the very next request. */
async function adminScope(em: EntityManager, admin: SessionUser): Promise<AdminScope> {
  const me = await em.findOne(UserEntity, { where: { id: admin.id }, relations: { stations: true } });
  if (!me || !me.active) throw unauthenticated();
  return scopeOf(me);
}

export async function listUsers(db: DataSource, admin: SessionUser): Promise<UserList> {
  const scope = await adminScope(db.manager, admin);
  const all = await db.getRepository(UserEntity).find({ relations: { stations: true }, order: { displayName: 'ASC' } });
  return { users: all.filter((u) => seesUser(scope, u)).map((u) => presentUser(u, scope)), viewer: { carrierWide: scope.carrierWide } };
}

async function loadStations(em: EntityManager, ids: number[]) {
  const stations = await em.findBy(StationEntity, { id: In(ids) });
  if (stations.length !== new Set(ids).size) throw badRequest('stationIds: every station must exist', [{ field: 'stationIds', rule: 'every station must exist' }]);
  return stations;
}

export async function createUser(db: DataSource, admin: SessionUser, body: CreateUserBody) {
  const passwordHash = await hashPassword(body.password);
  return db.transaction(async (em) => {
    const scope = await adminScope(em, admin);
    assertMayGrantStations(scope, body.stationIds);
    assertMayGrantCarrierWide(scope, body.carrierWide ?? false, body.role);
    const stations = await loadStations(em, body.stationIds);
    const email = body.email.toLowerCase();
    if (await em.findOneBy(UserEntity, { email })) throw conflict('email_taken', 'A user with this e-mail already exists.');
    const user = em.create(UserEntity, { email, displayName: body.displayName, role: body.role, passwordHash, active: true, carrierWide: body.carrierWide ?? false, stations });
    // Two creates racing past the check above meet at the unique index: the loser is a conflict, not a failure.
    await em.save(user).catch((err: unknown) => {
      throw isDuplicateKey(err) ? conflict('email_taken', 'A user with this e-mail already exists.') : err;
    });
    await audit(em, { actor: admin, action: 'user.created', entityType: 'user', entityId: user.id, after: presentUser(user) });
    return presentUser(user, scope);
  });
}

export interface UserChangeEffects {
  email: string;
  /** Deactivated or given a new password: every session and socket of the user must end. */
  signedOut: boolean;
  passwordReset: boolean;
  /** Role or stations changed: open sockets must drop the rooms the user may no longer watch. */
  accessChanged: boolean;
}

function assertNotLockingSelfOut(admin: SessionUser, id: number, body: UpdateUserBody) {
  if (id !== admin.id) return;
  const field = body.active === false ? 'active' : body.role && body.role !== 'admin' ? 'role' : body.carrierWide === false ? 'carrierWide' : null;
  if (field) throw badRequest('You cannot deactivate yourself or narrow your own admin reach.', [{ field, rule: 'an admin cannot lock themselves out' }]);
}

export async function updateUser(db: DataSource, admin: SessionUser, id: number, body: UpdateUserBody) {
  assertNotLockingSelfOut(admin, id, body);
  const passwordHash = body.password ? await hashPassword(body.password) : undefined;
  return db.transaction(async (em) => {
    const scope = await adminScope(em, admin);
    // FOR UPDATE without an OF list: TypeORM accepts `tables` only on PostgreSQL and throws on MariaDB.
    const user = await em.findOne(UserEntity, { where: { id }, relations: { stations: true }, lock: { mode: 'pessimistic_write' } });
    assertMayManage(scope, user);
    if (body.stationIds) assertMayGrantStations(scope, body.stationIds);
    const role = body.role ?? user.role;
    if (body.carrierWide !== undefined) assertMayGrantCarrierWide(scope, body.carrierWide, role);
    const stations = body.stationIds ? await loadStations(em, body.stationIds) : undefined;

    const before = presentUser(user);
    if (body.displayName !== undefined) user.displayName = body.displayName;
    user.role = role;
    // Carrier-wide reach belongs to the admin role: it goes when the role does.
    user.carrierWide = role === 'admin' && (body.carrierWide ?? user.carrierWide);
    if (body.active !== undefined) user.active = body.active;
    if (stations) user.stations = stations;
    if (passwordHash) user.passwordHash = passwordHash;
    await em.save(user);
    const after = presentUser(user);
    await audit(em, { actor: admin, action: body.active === false ? 'user.deactivated' : 'user.updated', entityType: 'user', entityId: id, before, after: { ...after, passwordChanged: Boolean(passwordHash) } });
    const signedOut = body.active === false || Boolean(passwordHash);
    if (signedOut) {
      // Ends every session of the user at once: deactivation or a new password must not wait for idle expiry.
      await em.query(`DELETE FROM sessions WHERE JSON_VALUE(data, '$.passport.user') = ?`, [id]);
    }
    const accessChanged = before.role !== after.role || before.carrierWide !== after.carrierWide || before.stations.map((s) => s.id).join() !== after.stations.map((s) => s.id).join();
    const effects: UserChangeEffects = { email: user.email, signedOut, passwordReset: Boolean(passwordHash), accessChanged };
    return { user: presentUser(user, scope), effects };
  });
}
