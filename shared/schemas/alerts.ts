// Alerts for the station and finance: payments lost (voided, canceled at the provider, refused) or near or past the
// rule's deadline, listed until the passenger is paid.
import { z } from 'zod';

export const ALERT_KINDS = ['payment-voided', 'payment-canceled', 'payment-failed', 'payment-due-soon', 'payment-overdue'] as const;
export type AlertKind = (typeof ALERT_KINDS)[number];

export const ALERT_KIND_LABELS: Record<AlertKind, string> = {
  'payment-voided': 'Payment voided by finance',
  'payment-canceled': 'Payment canceled by the payment provider',
  'payment-failed': 'Payment refused by the payment provider',
  'payment-due-soon': 'Payment due soon under the rule',
  'payment-overdue': 'Payment overdue under the rule',
};

export const alertQuerySchema = z.object({
  stationId: z.coerce.number({ error: 'stationId must be a number' }).int('stationId must be a whole number').positive('stationId must be positive').optional(),
  status: z.enum(['open', 'all'], { error: 'status must be open or all' }).default('open'),
});
export type AlertQuery = z.infer<typeof alertQuerySchema>;

export const alertViewSchema = z.object({
  id: z.number(),
  stationId: z.number(),
  stationIata: z.string(),
  flightId: z.number().nullable(),
  flight: z.string().nullable(),
  serviceDate: z.string().nullable(),
  compensationId: z.number().nullable(),
  passengerName: z.string().nullable(),
  kind: z.enum(ALERT_KINDS),
  message: z.string(),
  createdAt: z.string(),
  resolvedAt: z.string().nullable(),
  resolution: z.string().nullable(),
  acknowledgedAt: z.string().nullable(),
  acknowledgedBy: z.string().nullable(),
});
export type AlertView = z.infer<typeof alertViewSchema>;

export const alertsResponseSchema = z.object({ alerts: z.array(alertViewSchema) });
export const alertResponseSchema = z.object({ alert: alertViewSchema });
