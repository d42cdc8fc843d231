import type { SessionUser } from '@shared/schemas/auth';

/** Station scoping: a user sees only the stations they belong to. Services and the socket server ask the same question. */
export function canSeeStation(user: SessionUser, stationId: number): boolean {
  return user.stations.some((s) => s.id === stationId);
}
