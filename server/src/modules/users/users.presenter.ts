import type { User } from '@shared/schemas/users';
import type { UserEntity } from '../../db/entities';
import { presentSessionUser } from '../auth/session-user';
import { inScope, mayManage, type AdminScope } from './users.policy';

/**
 * Shapes a user for a viewer. A station admin sees only the stations the two of them share, and a count of the
 * rest; without a viewer (the audit trail) the whole user is shown.
 */
export function presentUser(u: UserEntity, viewer?: AdminScope): User {
  const { stations } = presentSessionUser(u);
  const shown = viewer ? stations.filter((s) => inScope(viewer, s.id)) : stations;
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    role: u.role,
    active: u.active,
    stations: shown,
    otherStations: stations.length - shown.length,
    carrierWide: u.carrierWide,
    manageable: viewer ? mayManage(viewer, u) : true,
    createdAt: u.createdAt.toISOString(),
  };
}
