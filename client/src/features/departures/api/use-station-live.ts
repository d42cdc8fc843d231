import { useQueryClient } from '@tanstack/react-query';
import { useLiveRoom } from '../../../lib/socket';
import { departureKeys } from './departures';

/** Keeps the board live: a change notice for the station marks its departures stale, and they refetch. */
export function useStationLive(stationId: number) {
  const qc = useQueryClient();
  const refetch = () => qc.invalidateQueries({ queryKey: departureKeys.station(stationId) });
  return useLiveRoom('station', stationId, { onChanged: refetch, onResync: refetch });
}
