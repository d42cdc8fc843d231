import type { EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { AuditLogEntity } from '../../db/entities';

export interface AuditEntry {
  actor: SessionUser | { label: string; userId?: number | null };
  action: string;
  entityType: string;
  entityId: string | number;
  stationId?: number | null;
  before?: unknown;
  after?: unknown;
}

/** Writes inside the caller's transaction, so the audit row exists exactly when the change does. */
export async function audit(em: EntityManager, e: AuditEntry): Promise<void> {
  const actorUserId = 'id' in e.actor ? e.actor.id : (e.actor.userId ?? null);
  const actorLabel = 'email' in e.actor ? e.actor.email : e.actor.label;
  await em.insert(AuditLogEntity, {
    actorUserId,
    actorLabel,
    action: e.action,
    entityType: e.entityType,
    entityId: String(e.entityId),
    stationId: e.stationId ?? null,
    before: (e.before ?? null) as object | null,
    after: (e.after ?? null) as object | null,
  });
}
