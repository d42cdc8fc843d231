import { useQueryClient } from '@tanstack/react-query';
import { useLiveRoom } from '../../../lib/socket';
import { deskCompensationKeys } from './compensations';
import { refundKeys } from './refunds';

/**
 * Topics that can add or move a compensation: an accepted volunteer or a processed denial makes one due, and the
 * payment steps move it on. A notice without topics is treated as "anything may have changed".
 */
const RELEVANT = new Set(['compensations', 'rounds', 'denials', 'cabin-changes']);

export function useFlightCompensationsLive(flightId: number) {
  const qc = useQueryClient();
  // Refunds become due with a compensation (or a recorded downgrade) and move with their payment rows.
  const refetch = () => Promise.all([qc.invalidateQueries({ queryKey: deskCompensationKeys.flight(flightId) }), qc.invalidateQueries({ queryKey: refundKeys.flight(flightId) })]);
  return useLiveRoom('flight', flightId, {
    onChanged: (p) => {
      if (!p.topics || p.topics.some((t) => RELEVANT.has(t))) void refetch();
    },
    onResync: () => void refetch(),
  });
}
