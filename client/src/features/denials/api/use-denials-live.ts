import { useQueryClient } from '@tanstack/react-query';
import { useLiveRoom } from '../../../lib/socket';
import { denialKeys } from './denials';

/** Each change notice for the flight marks its denial queries stale, and they refetch. */
export function useFlightDenialsLive(flightId: number) {
  const qc = useQueryClient();
  const refetch = () => qc.invalidateQueries({ queryKey: denialKeys.flight(flightId) });
  return useLiveRoom('flight', flightId, { onChanged: refetch, onResync: refetch });
}

/** Any change at the station may add or settle a proposal waiting for a supervisor. */
export function useStationDenialsLive(stationId: number) {
  const qc = useQueryClient();
  const refetch = () => qc.invalidateQueries({ queryKey: denialKeys.waiting(stationId) });
  return useLiveRoom('station', stationId, { onChanged: refetch, onResync: refetch });
}
