import { useQueryClient } from '@tanstack/react-query';
import { useLiveRoom } from '../../../lib/socket';
import { deskCompensationKeys } from './compensations';

/**
 * Topics that can add or move a compensation: an accepted volunteer or a processed denial makes one due, and the
 * payment steps move it on. A notice without topics is treated as "anything may have changed".
 */
const RELEVANT = new Set(['compensations', 'rounds', 'denials']);

export function useFlightCompensationsLive(flightId: number) {
  const qc = useQueryClient();
  const refetch = () => qc.invalidateQueries({ queryKey: deskCompensationKeys.flight(flightId) });
  return useLiveRoom('flight', flightId, {
    onChanged: (p) => {
      if (!p.topics || p.topics.some((t) => RELEVANT.has(t))) void refetch();
    },
    onResync: () => void refetch(),
  });
}
