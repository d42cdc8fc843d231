import type { SessionUser } from '@shared/schemas/auth';
import type { UserEntity } from '../../db/entities';
import { forbidden } from '../../http/errors';

/** An admin manages the people of their own stations, and may grant only stations they hold themselves. */
export function adminSharesStation(admin: SessionUser, target: UserEntity): boolean {
  const mine = new Set(admin.stations.map((s) => s.id));
  return target.stations.some((s) => mine.has(s.id));
}

export function adminHoldsStation(admin: SessionUser, stationId: number): boolean {
  return admin.stations.some((s) => s.id === stationId);
}

export function assertMayGrantStations(admin: SessionUser, stationIds: number[]): void {
  const mine = new Set(admin.stations.map((s) => s.id));
  const foreign = stationIds.filter((id) => !mine.has(id));
  if (foreign.length) throw forbidden(`You may only grant your own stations (not station ${foreign.join(', ')}).`);
}
