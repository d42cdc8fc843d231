// Who may manage whom. A station admin manages only users whose stations all lie within the admin's own: a user who
// also works at a station the admin does not hold is out of reach, or one station's admin could take over an account
// that another station relies on (reset its password, change its role, deactivate it). A carrier-wide admin is an
// explicit grant on the admin's own row, not inferred from holding many stations.
import type { UserEntity } from '../../db/entities';
import { badRequest, forbidden, notFound } from '../../domain/errors';

export interface AdminScope {
  adminId: number;
  carrierWide: boolean;
  stationIds: ReadonlySet<number>;
}

export function scopeOf(admin: UserEntity): AdminScope {
  return { adminId: admin.id, carrierWide: admin.carrierWide, stationIds: new Set((admin.stations ?? []).map((s) => s.id)) };
}

export const inScope = (scope: AdminScope, stationId: number) => scope.carrierWide || scope.stationIds.has(stationId);

/** Sees the user in the list: they share at least one station (a carrier-wide admin sees everyone). */
export const seesUser = (scope: AdminScope, target: UserEntity) => scope.carrierWide || target.stations.some((s) => scope.stationIds.has(s.id));

/** May change the user: every station of theirs is within scope, and a carrier-wide admin only by another. */
export function mayManage(scope: AdminScope, target: UserEntity): boolean {
  if (scope.carrierWide) return true;
  return !target.carrierWide && target.stations.length > 0 && target.stations.every((s) => scope.stationIds.has(s.id));
}

/** Not found when the admin cannot see the user at all (reveals nothing); forbidden when seen but out of reach. */
export function assertMayManage(scope: AdminScope, target: UserEntity | null): asserts target is UserEntity {
  if (!target || !seesUser(scope, target)) throw notFound('User');
  if (!mayManage(scope, target)) {
    throw forbidden(
      target.carrierWide
        ? 'This user is a carrier-wide admin; only another carrier-wide admin can change them.'
        : 'This user also works at stations outside yours; only a carrier-wide admin can change them.',
    );
  }
}

export function assertMayGrantStations(scope: AdminScope, stationIds: number[]): void {
  const foreign = stationIds.filter((id) => !inScope(scope, id));
  if (foreign.length) throw forbidden(`You may only grant your own stations (not station ${foreign.join(', ')}).`);
}

/** Carrier-wide reach is granted only by a carrier-wide admin, and only to an admin. */
export function assertMayGrantCarrierWide(scope: AdminScope, carrierWide: boolean, role: string): void {
  if (!carrierWide) return;
  if (!scope.carrierWide) throw forbidden('Only a carrier-wide admin may make another admin carrier-wide.');
  if (role !== 'admin') throw badRequest('carrierWide: only an admin can be carrier-wide', [{ field: 'carrierWide', rule: 'only an admin can be carrier-wide' }]);
}
