import { createHash, randomBytes } from 'node:crypto';
import { IsNull, type DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { IntegrationKeyEntity } from '../../db/entities';
import { notFound, unauthenticated } from '../../domain/errors';
import { audit } from '../audit/audit.service';

export const hashKey = (key: string) => createHash('sha256').update(key).digest('hex');

export function presentKey(k: IntegrationKeyEntity) {
  return { id: k.id, stationId: k.stationId, name: k.name, prefix: k.prefix, createdAt: k.createdAt.toISOString(), revokedAt: k.revokedAt?.toISOString() ?? null, lastUsedAt: k.lastUsedAt?.toISOString() ?? null };
}

/** A new key, returned in full exactly once; only its hash is stored. */
export async function createIntegrationKey(db: DataSource, stationId: number, name: string, actor: SessionUser | { label: string }) {
  const key = `bbk_${randomBytes(24).toString('base64url')}`;
  return db.transaction(async (em) => {
    const row = await em.save(em.create(IntegrationKeyEntity, { stationId, name, prefix: key.slice(0, 10), keyHash: hashKey(key), createdByUserId: 'id' in actor ? actor.id : null, revokedAt: null, lastUsedAt: null }));
    await audit(em, { actor, action: 'integration_key.created', entityType: 'integration_key', entityId: row.id, stationId, after: presentKey(row) });
    return { ...presentKey(row), key };
  });
}

/**
 * Keys found valid, by hash, for a few seconds: a feed presents its key on every POST. A revocation here drops the
 * key at once; another server process stops accepting it within KNOWN_KEY_MS. Unknown keys are never remembered.
 */
const knownKeys = new Map<string, { stationId: number; keyId: number; until: number }>();
const KNOWN_KEY_MS = 5_000;

export async function revokeIntegrationKey(db: DataSource, stationId: number, keyId: number, actor: SessionUser) {
  return db.transaction(async (em) => {
    const row = await em.findOneBy(IntegrationKeyEntity, { id: keyId, stationId });
    if (!row) throw notFound('Integration key');
    if (!row.revokedAt) {
      const before = presentKey(row);
      row.revokedAt = new Date();
      await em.save(row);
      knownKeys.delete(row.keyHash);
      await audit(em, { actor, action: 'integration_key.revoked', entityType: 'integration_key', entityId: row.id, stationId, before, after: presentKey(row) });
    }
    return presentKey(row);
  });
}

/** When each key's "last used" was last written: a busy feed would otherwise rewrite the same row on every batch. */
const lastUsedWritten = new Map<number, number>();
const LAST_USED_RESOLUTION_MS = 60_000;

/** The station a presented key belongs to, or null for an unknown or revoked key. */
export async function stationForKey(db: DataSource, presented: string): Promise<{ stationId: number; keyId: number } | null> {
  const hash = hashKey(presented);
  const known = knownKeys.get(hash);
  if (known && known.until > Date.now()) return { stationId: known.stationId, keyId: known.keyId };
  knownKeys.delete(hash);
  const row = await db.getRepository(IntegrationKeyEntity).findOneBy({ keyHash: hash, revokedAt: IsNull() });
  if (!row) return null;
  const now = Date.now();
  knownKeys.set(hash, { stationId: row.stationId, keyId: row.id, until: now + KNOWN_KEY_MS });
  if (now - (lastUsedWritten.get(row.id) ?? 0) >= LAST_USED_RESOLUTION_MS) {
    lastUsedWritten.set(row.id, now);
    await db.getRepository(IntegrationKeyEntity).update({ id: row.id }, { lastUsedAt: new Date(now) });
  }
  return { stationId: row.stationId, keyId: row.id };
}

/** The feed's caller: the station of the key it presented; refuses a missing, unknown or revoked key. */
export async function requireStationForKey(db: DataSource, presented: string | undefined): Promise<{ stationId: number; keyId: number }> {
  const key = presented ? await stationForKey(db, presented) : null;
  if (!key) throw unauthenticated('invalid_api_key', 'Send a valid integration key as "Authorization: Bearer <key>". Keys are created by an admin in Station setup.');
  return key;
}
