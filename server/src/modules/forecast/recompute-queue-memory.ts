// The recompute queue's contract held in memory, for one process alone: the scheduler's unit tests run on it.
import type { ClaimedRecompute, RecomputeQueue } from './recompute-queue';

interface Row {
  requests: number;
  onlyIfMoved: boolean;
  claimed: { requests: number; onlyIfMoved: boolean } | null;
}

export function memoryRecomputeQueue(): RecomputeQueue & { size(): number } {
  const rows = new Map<number, Row>();
  return {
    size: () => rows.size,
    async mark(flightIds, onlyIfMoved) {
      for (const id of new Set(flightIds)) {
        const row = rows.get(id);
        if (row) {
          row.requests += 1;
          row.onlyIfMoved = row.onlyIfMoved && onlyIfMoved;
        } else rows.set(id, { requests: 1, onlyIfMoved, claimed: null });
      }
    },
    async claim(limit) {
      const out: ClaimedRecompute[] = [];
      for (const [flightId, row] of rows) {
        if (out.length >= limit) break;
        if (row.claimed) continue;
        row.claimed = { requests: row.requests, onlyIfMoved: row.onlyIfMoved };
        row.onlyIfMoved = true;
        out.push({ flightId, onlyIfMoved: row.claimed.onlyIfMoved });
      }
      return out;
    },
    async finish(claim) {
      const row = rows.get(claim.flightId);
      if (!row?.claimed) return false;
      rows.delete(claim.flightId);
      if (row.requests === row.claimed.requests) return false;
      // Asked again meanwhile: back into the line, behind the flights that have waited longer.
      row.claimed = null;
      rows.set(claim.flightId, row);
      return true;
    },
  };
}
