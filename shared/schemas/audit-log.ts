// The audit viewer's filters and rows.
import { z } from 'zod';

const instant = (field: string) => z.iso.datetime({ offset: true, error: `${field} must be an ISO 8601 date-time with an offset (2026-12-03T08:00:00Z)` });

export const auditQuerySchema = z
  .object({
    flightId: z.coerce.number({ error: 'flightId must be a number' }).int('flightId must be a whole number').positive('flightId must be positive').optional(),
    /** Part of who acted: an e-mail, "integration key 3", "system". */
    actor: z.string().trim().max(100, 'actor must be at most 100 characters').optional(),
    /** An action or the start of one: "flight.cancelled", or "flight." for every flight action. */
    action: z.string().trim().max(64, 'action must be at most 64 characters').regex(/^[a-z0-9_.-]*$/, 'action may hold only lower-case letters, digits, dots, hyphens and underscores').optional(),
    from: instant('from').optional(),
    to: instant('to').optional(),
    /** Paging: rows older than this row id. */
    beforeId: z.coerce.number({ error: 'beforeId must be a number' }).int('beforeId must be a whole number').positive('beforeId must be positive').optional(),
  })
  .refine((q) => !q.from || !q.to || Date.parse(q.from) <= Date.parse(q.to), { path: ['to'], message: 'to must not be before from' });
export type AuditQuery = z.infer<typeof auditQuerySchema>;

export const auditRowSchema = z.object({
  id: z.string(),
  at: z.string(),
  actor: z.string(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string(),
  before: z.unknown(),
  after: z.unknown(),
});
export type AuditRow = z.infer<typeof auditRowSchema>;
export const auditPageSchema = z.object({ rows: z.array(auditRowSchema), nextBeforeId: z.string().nullable(), actions: z.array(z.string()) });
export type AuditPage = z.infer<typeof auditPageSchema>;
