import { useQueryClient } from '@tanstack/react-query';
import type { ChangedPayload } from '@shared/events';
import { useLiveRoom } from '../../../lib/socket';
import { deskCareKeys } from './desk-care';

/**
 * Topics that change what the care panel shows: a choice or care recorded (by any agent), a volunteer accepted or
 * a denial rebooked (a new case, a new alternate and so a new wait), a payment step on the compensation. The
 * forecast's own ticks never move care, so they fetch nothing; a notice without topics may be anything.
 */
const RELEVANT = new Set(['care', 'compensations', 'denials', 'rounds']);

export const careNoticeRefetches = (p: ChangedPayload): boolean => !p.topics || p.topics.some((t) => RELEVANT.has(t));

export function useFlightCareLive(flightId: number) {
  const qc = useQueryClient();
  const refetch = () => qc.invalidateQueries({ queryKey: deskCareKeys.flight(flightId) });
  return useLiveRoom('flight', flightId, {
    onChanged: (p) => {
      if (careNoticeRefetches(p)) void refetch();
    },
    onResync: () => void refetch(),
  });
}
