// A station's notices as the Notices screen lists and opens them.
import { z } from 'zod';

export const NOTICE_STATES = ['pending', 'sent', 'failed'] as const;

export const noticesQuerySchema = z.object({
  status: z.enum(NOTICE_STATES, { error: 'status must be one of pending, sent, failed' }).optional(),
  /** Part of the recipient's address or the subject. */
  q: z.string().trim().max(100, 'q must be at most 100 characters').optional(),
  flightId: z.coerce.number({ error: 'flightId must be a number' }).int('flightId must be a whole number').positive('flightId must be positive').optional(),
});
export type NoticesQuery = z.infer<typeof noticesQuerySchema>;

export const stationNoticeSchema = z.object({
  id: z.string(),
  kind: z.string(),
  to: z.string(),
  subject: z.string(),
  status: z.enum(NOTICE_STATES),
  attempts: z.number(),
  lastError: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
  nextAttemptAt: z.string(),
  flight: z.object({ id: z.number(), label: z.string() }).nullable(),
  /** Set on a copy sent again: the notice it repeats. */
  resendOf: z.string().nullable(),
});
export type StationNotice = z.infer<typeof stationNoticeSchema>;
export const stationNoticeListSchema = z.object({ notices: z.array(stationNoticeSchema), limit: z.number(), counts: z.object({ pending: z.number(), sent: z.number(), failed: z.number() }) });
export type StationNoticeList = z.infer<typeof stationNoticeListSchema>;

/** The message as it went to the passenger: the plain text and, where one was sent, the HTML part. */
export const noticeDetailSchema = stationNoticeSchema.extend({ text: z.string(), html: z.string().nullable() });
export type NoticeDetail = z.infer<typeof noticeDetailSchema>;
