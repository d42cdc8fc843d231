import type { DataSource } from 'typeorm';
import { recomputeFlight } from '../forecast/forecast.service';

/** Told which flights' inputs changed; the app wires this to the forecast scheduler so live consoles hear of it. */
export type FlightsChanged = (flightIds: number[]) => void;

/**
 * Without a scheduler (a router built on its own), recompute right here, one flight after another, after the
 * response: the change is already stored, and a failed recompute only leaves the figures as they were until the next.
 */
export function recomputeInBackground(db: DataSource): FlightsChanged {
  return (flightIds) => {
    void (async () => {
      for (const id of flightIds) {
        await recomputeFlight(db, id).catch((err: unknown) => console.error(`[forecast] recompute of flight ${id} failed: ${err instanceof Error ? err.message : err}`));
      }
    })();
  };
}
