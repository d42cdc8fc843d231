import { useCallback, useSyncExternalStore } from 'react';
import { useQuery } from '@tanstack/react-query';
import { sessionQueryOptions } from '../lib/session';

const KEY = 'bumpboard.station';
const listeners = new Set<() => void>();

function subscribe(l: () => void) {
  listeners.add(l);
  return () => listeners.delete(l);
}

/** The station the user is working, remembered on this device; always one of the stations they belong to. */
export function useCurrentStation() {
  const { data } = useQuery(sessionQueryOptions());
  const stations = data?.user?.stations ?? [];
  const stored = useSyncExternalStore(subscribe, () => localStorage.getItem(KEY));
  const station = stations.find((s) => String(s.id) === stored) ?? stations[0] ?? null;
  const choose = useCallback((id: number) => {
    localStorage.setItem(KEY, String(id));
    listeners.forEach((l) => l());
  }, []);
  return { station, stations, choose };
}
