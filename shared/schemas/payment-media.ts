// How a compensation reaches the passenger: the medium chosen at the desk, the passenger's agreement to a card or a
// credit, and money handed over at the counter. Money is integer minor units with its ISO 4217 currency.
import { z } from 'zod';
import { MEDIA } from '../compensation/media';

export const mediumSchema = z.enum(MEDIA, { error: `medium must be one of ${MEDIA.join(', ')}` });
export const AGREEMENT_MEDIA_CODES = ['prepaid-card', 'travel-credit'] as const;
export const COUNTER_MEDIA = ['cash', 'cheque'] as const;

export const MEDIUM_LABELS: Record<(typeof MEDIA)[number], string> = {
  cash: 'Cash at the counter',
  cheque: 'Cheque at the counter',
  'bank-transfer': 'Bank transfer',
  'prepaid-card': 'Prepaid card',
  'travel-credit': 'Travel credit',
};

const PNG_DATA_URL = /^data:image\/png;base64,[A-Za-z0-9+/=]+$/;
const signature = z
  .string({ error: 'signature is required: the passenger signs on the screen' })
  .max(700_000, 'signature must be at most 700,000 characters')
  .regex(PNG_DATA_URL, 'signature must be a PNG image (data:image/png;base64,…) drawn on the screen')
  .refine((s) => s.length > 'data:image/png;base64,'.length + 200, 'signature is empty: the passenger must sign');
const minor = (field: string) => z.number({ error: `${field} must be a number of minor units` }).int(`${field} must be whole minor units`).min(0, `${field} must be 0 or more`);

export const mediumBodySchema = z.object({ medium: mediumSchema });

export const agreementBodySchema = z.object({
  medium: z.enum(AGREEMENT_MEDIA_CODES, { error: 'medium must be prepaid-card or travel-credit: only these need an agreement' }),
  valueMinor: minor('valueMinor'),
  expiresOn: z.iso.date({ error: 'expiresOn must be a date YYYY-MM-DD, or null when it never expires' }).nullable(),
  text: z.string({ error: 'text is required: the exact words shown to the passenger' }).min(20, 'text must be the words shown, at least 20 characters').max(4000, 'text must be at most 4000 characters'),
  signature,
});
export type AgreementBody = z.infer<typeof agreementBodySchema>;

export const counterPaymentBodySchema = z
  .object({
    medium: z.enum(COUNTER_MEDIA, { error: 'medium must be cash or cheque at the counter' }),
    drawerId: z.string().trim().min(1, 'drawerId must not be empty').max(32, 'drawerId must be at most 32 characters').optional(),
    chequeNumber: z.string().trim().regex(/^[A-Za-z0-9-]{1,32}$/, 'chequeNumber must be 1 to 32 letters, digits or dashes').optional(),
    amountMinor: minor('amountMinor').refine((n) => n > 0, 'amountMinor must be more than 0'),
    signature,
  })
  .superRefine((body, ctx) => {
    if (body.medium === 'cash' && !body.drawerId) ctx.addIssue({ code: 'custom', path: ['drawerId'], message: 'drawerId is required for cash: the drawer the money came from' });
    if (body.medium === 'cheque' && !body.chequeNumber) ctx.addIssue({ code: 'custom', path: ['chequeNumber'], message: 'chequeNumber is required for a cheque' });
  });
export type CounterPaymentBody = z.infer<typeof counterPaymentBodySchema>;

export const actualArrivalBodySchema = z.object({
  arrivalDelayMinutes: z.number({ error: 'arrivalDelayMinutes must be a number of minutes' }).int('arrivalDelayMinutes must be whole minutes').min(0, 'arrivalDelayMinutes must be 0 or more').max(10_080, 'arrivalDelayMinutes must be at most a week'),
});

export const paymentTermsViewSchema = z.object({
  media: z.array(mediumSchema),
  needsAgreement: z.array(mediumSchema),
  dueBy: z.string().nullable(),
  /** Against the deadline at the moment of the answer; null when there is none or the payment is done. */
  dueStatus: z.enum(['overdue', 'due-soon', 'in-time']).nullable(),
  ruleRef: z.string(),
  /** Conditions on a card or credit: its value against the cash, written information, no expiry. */
  conditions: z.object({ value: z.enum(['at-least', 'greater', 'any']), writtenInformation: z.boolean(), noExpiry: z.boolean(), ruleRef: z.string() }),
  restrictions: z.array(z.string()),
  /** The station's zone, in which the deadline is shown. */
  timeZone: z.string(),
  /** Media the rule allows that cannot pay this case (a transfer in a currency the provider does not move), with why. */
  unavailable: z.array(z.object({ medium: mediumSchema, reason: z.string() })).optional(),
});

export const agreementViewSchema = z.object({
  medium: mediumSchema,
  method: z.enum(['desk-signature', 'phone', 'recorded-statement']),
  text: z.string(),
  cashAmountMinor: z.number(),
  valueMinor: z.number(),
  currency: z.string(),
  expiresOn: z.string().nullable(),
  acceptedAt: z.string(),
  staffUserId: z.number().nullable(),
  signed: z.boolean(),
});

export const counterPaymentViewSchema = z.object({
  medium: z.enum(COUNTER_MEDIA),
  drawerId: z.string().nullable(),
  chequeNumber: z.string().nullable(),
  amountMinor: z.number(),
  currency: z.string(),
  paidAt: z.string(),
  paidByUserId: z.number(),
  receiptText: z.string(),
});

/** The passenger's current payout or card-details link: where it stands, and whether the desk may send a new one. */
export const passengerLinkViewSchema = z.object({
  purpose: z.enum(['payout', 'card-details']),
  state: z.enum(['ready', 'used', 'expired', 'locked']),
  expiresAt: z.string(),
  replaceable: z.boolean(),
});
export type PassengerLinkView = z.infer<typeof passengerLinkViewSchema>;
/** The answer to the desk's "send a new link": which link went out and until when it works. */
export const newLinkResponseSchema = z.object({ link: z.object({ purpose: z.enum(['payout', 'card-details']), expiresAt: z.string() }) });

/** What the desk needs beside the compensation itself to choose a medium and pay. */
export const paymentMediaViewSchema = z.object({
  terms: paymentTermsViewSchema,
  agreement: agreementViewSchema.nullable(),
  counterPayment: counterPaymentViewSchema.nullable(),
  /** Absent when the compensation has no passenger link (nothing issued, or paid at the counter). */
  passengerLink: passengerLinkViewSchema.nullable().optional(),
});
export type PaymentMediaView = z.infer<typeof paymentMediaViewSchema>;

/** The printable receipt: what was paid, how, and the agreement's text where there is one. */
export const receiptSchema = z.object({
  compensationId: z.number(),
  lines: z.array(z.string()),
  agreementText: z.string().nullable(),
  signature: z.string().nullable(),
});
export const receiptResponseSchema = z.object({ receipt: receiptSchema });

// ── Finance: the counter register (cash drawers and cheques) ─────────────────────────────────────────────────

export const counterRegisterQuerySchema = z
  .object({
    stationId: z.coerce.number({ error: 'stationId must be a number' }).int('stationId must be a whole number').positive('stationId must be positive').optional(),
    from: z.iso.date({ error: 'from must be a date YYYY-MM-DD' }).optional(),
    to: z.iso.date({ error: 'to must be a date YYYY-MM-DD' }).optional(),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'to must not be before from', path: ['to'] });
export type CounterRegisterQuery = z.infer<typeof counterRegisterQuerySchema>;

export const counterRegisterResponseSchema = z.object({
  /** Cash handed out per station, drawer and currency: what each drawer must be short by at the count. */
  drawers: z.array(z.object({ stationIata: z.string(), drawerId: z.string(), currency: z.string(), count: z.number(), amountMinor: z.number() })),
  /** Every cheque written, for the cheque register. */
  cheques: z.array(z.object({ stationIata: z.string(), chequeNumber: z.string(), compensationId: z.number(), passengerName: z.string(), amountMinor: z.number(), currency: z.string(), paidAt: z.string() })),
});
export type CounterRegister = z.infer<typeof counterRegisterResponseSchema>;
