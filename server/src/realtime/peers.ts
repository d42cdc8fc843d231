// Several app processes behind a balancer: socket.io's rooms span them through the Redis adapter (a notice emitted
// by the process that recomputed reaches the consoles connected to any process), and each process learns from the
// others which flights moved, so it never serves a desk payload or a denial ranking older than a notice already sent.
import { createAdapter } from '@socket.io/redis-adapter';
import { createClient } from 'redis';
import type { DataSource } from 'typeorm';
import { heldRankingsOf } from '../modules/denials/candidates-held';
import { liveStoreOf } from '../modules/forecast/live-store';
import { sharedServers, type AppIo } from './socket-server';

/** Connects the socket.io server to Redis; returns a function that closes both connections. */
export async function shareThroughRedis(io: AppIo, url: string): Promise<() => Promise<void>> {
  const pub = createClient({ url });
  const sub = pub.duplicate();
  // A lost connection is retried by the client; logged, never fatal to the process.
  for (const c of [pub, sub]) c.on('error', (err: unknown) => console.error(`[redis] ${err instanceof Error ? err.message : String(err)}`));
  await Promise.all([pub.connect(), sub.connect()]);
  io.adapter(createAdapter(pub, sub));
  sharedServers.add(io);
  return async () => {
    await Promise.allSettled([pub.quit(), sub.quit()]);
  };
}

/** What another process announced: its newer version replaces ours at the next read, and the ranking is built anew. */
export function followPeers(io: AppIo, db: DataSource) {
  io.on('flight:moved', (flightId, version) => {
    if (version !== null) liveStoreOf(db).dropOlder(flightId, version);
    heldRankingsOf(db).flightMoved(flightId);
  });
}
