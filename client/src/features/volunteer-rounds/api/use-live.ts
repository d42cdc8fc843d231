import { useQueryClient } from '@tanstack/react-query';
import { useLiveRoom } from '../../../lib/socket';
import { volunteerKeys } from './rounds';

/** Keeps the rounds panel live: a notice naming rounds (or naming nothing) refetches them; seat counts move alternates. */
export function useRoundsLive(flightId: number) {
  const qc = useQueryClient();
  return useLiveRoom('flight', flightId, {
    onChanged: (p) => {
      if (!p.topics || p.topics.includes('rounds')) void qc.invalidateQueries({ queryKey: volunteerKeys.rounds(flightId) });
      if (!p.topics || p.topics.includes('counts')) void qc.invalidateQueries({ queryKey: volunteerKeys.alternates(flightId) });
    },
    onResync: () => void qc.invalidateQueries({ queryKey: volunteerKeys.flight(flightId) }),
  });
}

/**
 * Keeps the approvals list live. Any notice for the station refetches it: approvals are asked and decided on the
 * station's flights, and every such change reaches the station's room.
 */
export function useApprovalsLive(stationId: number | null) {
  const qc = useQueryClient();
  const refetch = () => void qc.invalidateQueries({ queryKey: volunteerKeys.approvals() });
  return useLiveRoom('station', stationId, { onChanged: refetch, onResync: refetch });
}
