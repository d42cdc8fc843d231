import { useQueryClient } from '@tanstack/react-query';
import { useLiveRoom } from '../../../lib/socket';
import { flightKeys } from './flight-desk';

/** Keeps the desk live: each change notice for this flight marks all of its queries stale, and they refetch. */
export function useFlightLive(flightId: number) {
  const qc = useQueryClient();
  const refetchAll = () => qc.invalidateQueries({ queryKey: flightKeys.detail(flightId) });
  return useLiveRoom('flight', flightId, { onChanged: refetchAll, onResync: refetchAll });
}
