// Alerts for the station and finance: payments lost (voided, canceled at the provider, refused) or near or past the
// rule's deadline, listed until the passenger is paid; and work waiting at the station (a volunteer from a phone, an
// amount for a supervisor, a denial proposal), listed until it is decided.
import { z } from 'zod';

export const PAYMENT_ALERT_KINDS = ['payment-voided', 'payment-canceled', 'payment-failed', 'payment-due-soon', 'payment-overdue'] as const;
export const WORK_ALERT_KINDS = ['volunteer-offered', 'approval-waiting', 'approval-decided', 'denial-proposed'] as const;
export const ALERT_KINDS = [...PAYMENT_ALERT_KINDS, ...WORK_ALERT_KINDS] as const;
export type AlertKind = (typeof ALERT_KINDS)[number];

export const ALERT_KIND_LABELS: Record<AlertKind, string> = {
  'payment-voided': 'Payment voided by finance',
  'payment-canceled': 'Payment canceled by the payment provider',
  'payment-failed': 'Payment refused by the payment provider',
  'payment-due-soon': 'Payment due soon under the rule',
  'payment-overdue': 'Payment overdue under the rule',
  'volunteer-offered': 'A passenger volunteered from their phone',
  'approval-waiting': 'An amount waits for a supervisor',
  'approval-decided': 'A supervisor decided an amount',
  'denial-proposed': 'A denied-boarding proposal waits for a supervisor',
};

/** What the person reading the alert does next, in words. */
export const ALERT_NEXT_STEP: Record<AlertKind, string> = {
  'payment-voided': 'The passenger is still owed: re-issue the payment from the flight’s compensation panel or the ledger, giving the reason.',
  'payment-canceled': 'The passenger is still owed: re-issue the payment from the flight’s compensation panel or the ledger, giving the reason.',
  'payment-failed': 'The passenger is still owed: re-issue the payment from the flight’s compensation panel or the ledger, giving the reason.',
  'payment-due-soon': 'Pay the passenger from the flight’s compensation panel before the deadline.',
  'payment-overdue': 'Pay the passenger now from the flight’s compensation panel.',
  'volunteer-offered': 'Open the flight and accept or decline the offer in the volunteer round.',
  'approval-waiting': 'A supervisor of the station approves or declines it on Station day.',
  'approval-decided': 'Open the flight to carry on with the decided amount.',
  'denial-proposed': 'A supervisor of the station authorizes, changes or withdraws it on Station day.',
};

/**
 * Alerts that only inform: dismissing one closes it. Every other alert stays listed until its subject is decided
 * or the passenger is paid; dismissing it only says someone is on it, and takes it out of the count.
 */
export const INFORMATIONAL_ALERT_KINDS: readonly AlertKind[] = ['volunteer-offered', 'approval-decided'];

/** Finance works the money; the station's other work is not theirs to see. */
export const isPaymentAlert = (kind: AlertKind) => (PAYMENT_ALERT_KINDS as readonly string[]).includes(kind);

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
