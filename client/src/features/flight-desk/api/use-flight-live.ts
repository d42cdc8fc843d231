import { useQueryClient } from '@tanstack/react-query';
import { useLiveRoom } from '../../../lib/socket';
import { flightKeys } from './flight-desk';
import { applyFlightNotice } from './live-patch';

/**
 * Keeps the desk live: each notice patches the desk's cache to its version; a missed version refetches the lists
 * it left behind, and a reconnect refetches everything (anything may have moved while we were away).
 */
export function useFlightLive(flightId: number) {
  const qc = useQueryClient();
  return useLiveRoom('flight', flightId, {
    onChanged: (p) => {
      for (const queryKey of applyFlightNotice(qc, flightId, p)) void qc.invalidateQueries({ queryKey, exact: true });
    },
    onResync: () => void qc.invalidateQueries({ queryKey: flightKeys.detail(flightId) }),
  });
}
