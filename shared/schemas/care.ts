// Care while a denied passenger waits and the passenger's choice: the station's allowances and hotels, the desk's records.
import { z } from 'zod';
import { CARE_KINDS } from '../compensation/care-rules';
import { CHOICE_KINDS } from '../compensation/choice-rules';

/** Whole minor units, at most 100,000.00 of any currency: a meal or a night is never more. */
const minor = (field: string) =>
  z.number({ error: `${field} must be a number of minor units` }).int(`${field} must be a whole number of minor units`).nonnegative(`${field} must not be negative`).max(10_000_000, `${field} must be at most 10000000 minor units`);

const text = (field: string, min: number, max: number) =>
  z.string({ error: `${field} is required` }).trim().min(min, `${field} must have at least ${min} character${min === 1 ? '' : 's'}`).max(max, `${field} must be at most ${max} characters`);

export const partnerHotelSchema = z.object({
  /** Given by the server when a hotel is added; kept while the hotel stays on the list. */
  id: z.string().regex(/^[a-z0-9-]{1,24}$/, 'id must be the hotel id the server gave').optional(),
  name: text('name', 2, 120),
  address: text('address', 3, 200),
  phone: text('phone', 3, 40),
  nightlyRateMinor: minor('nightlyRateMinor'),
});
export type PartnerHotel = z.infer<typeof partnerHotelSchema>;

export const careSetupBodySchema = z.object({
  refreshmentMinor: minor('refreshmentMinor'),
  mealMinor: minor('mealMinor'),
  hotels: z.array(partnerHotelSchema, { error: 'hotels must be a list' }).max(30, 'hotels must list at most 30 partner hotels'),
});
export type CareSetupBody = z.infer<typeof careSetupBodySchema>;

export const careSetupSchema = z.object({
  stationId: z.number(),
  currency: z.string(),
  refreshmentMinor: z.number(),
  mealMinor: z.number(),
  hotels: z.array(partnerHotelSchema.required({ id: true })),
  /** False until an admin saved the station's allowances: the amounts shown are zero, not a policy. */
  configured: z.boolean(),
});
export type CareSetup = z.infer<typeof careSetupSchema>;
export const careSetupResponseSchema = z.object({ setup: careSetupSchema });

export const choiceKindSchema = z.enum(CHOICE_KINDS, { error: `kind must be one of ${CHOICE_KINDS.join(', ')}` });
export const careKindSchema = z.enum(CARE_KINDS, { error: `kind must be one of ${CARE_KINDS.join(', ')}` });

export const recordChoiceBodySchema = z.object({
  kind: choiceKindSchema,
  /** What the passenger asked for, in the agent's words (e.g. the later date wanted). */
  note: z.string({ error: 'note must be text' }).trim().max(300, 'note must be at most 300 characters').default(''),
});
export type RecordChoiceBody = z.infer<typeof recordChoiceBodySchema>;

export const recordCareBodySchema = z.object({
  kind: careKindSchema,
  /** What was handed over or booked, in plain words (e.g. "meal voucher", "taxi both ways"). */
  description: text('description', 3, 200),
  /** The cost to the carrier; absent when nothing was paid (e.g. calls from the desk phone). */
  amountMinor: minor('amountMinor').optional(),
  /** A hotel night: the partner hotel booked. */
  hotelId: z.string().regex(/^[a-z0-9-]{1,24}$/, 'hotelId must be the id of one of the station’s partner hotels').optional(),
  /** Who gave or booked it: the agent, the hotel desk, the taxi company. */
  providedBy: text('providedBy', 2, 120),
});
export type RecordCareBody = z.infer<typeof recordCareBodySchema>;

const careDueItemSchema = z.object({
  kind: careKindSchema,
  description: z.string(),
  quantity: z.number(),
  source: z.string(),
  basis: z.enum(['regulation', 'common-practice']),
  /** The station's allowance times the quantity, for meals and refreshments; the hotel's rate for a night. */
  suggestedMinor: z.number().nullable(),
});

const choiceOfferSchema = z.object({ kind: choiceKindSchema, label: z.string(), detail: z.string(), source: z.string(), basis: z.string() });

export const careGivenSchema = z.object({
  id: z.number(),
  kind: careKindSchema,
  description: z.string(),
  amountMinor: z.number().nullable(),
  currency: z.string().nullable(),
  hotelName: z.string().nullable(),
  providedBy: z.string(),
  recordedBy: z.string(),
  recordedAt: z.string(),
});
export type CareGiven = z.infer<typeof careGivenSchema>;

export const recordedChoiceSchema = z.object({
  kind: choiceKindSchema, label: z.string(), detail: z.string(), note: z.string(), recordedBy: z.string(), recordedAt: z.string(),
});

export const passengerCareSchema = z.object({
  compensationId: z.number(),
  passengerId: z.number(),
  passengerName: z.string(),
  voluntary: z.boolean(),
  regime: z.string(),
  /** The alternate this passenger waits for; null when none is booked. */
  alternate: z.object({ label: z.string(), departure: z.string() }).nullable(),
  offers: z.array(choiceOfferSchema),
  choice: recordedChoiceSchema.nullable(),
  refundOwed: z.object({ amountMinor: z.number(), currency: z.string(), state: z.string() }).nullable(),
  proposal: z.object({ waitMinutes: z.number().nullable(), nights: z.number(), items: z.array(careDueItemSchema), notes: z.array(z.string()) }),
  given: z.array(careGivenSchema),
});
export type PassengerCare = z.infer<typeof passengerCareSchema>;

export const flightCareResponseSchema = z.object({
  timeZone: z.string(),
  currency: z.string(),
  hotels: z.array(partnerHotelSchema.required({ id: true })),
  allowancesConfigured: z.boolean(),
  passengers: z.array(passengerCareSchema),
});
export type FlightCareResponse = z.infer<typeof flightCareResponseSchema>;

export const careLedgerQuerySchema = z.object({
  stationId: z.coerce.number({ error: 'stationId must be a number' }).int('stationId must be a whole number').positive('stationId must be positive').optional(),
  from: z.iso.date({ error: 'from must be a date YYYY-MM-DD' }).optional(),
  to: z.iso.date({ error: 'to must be a date YYYY-MM-DD' }).optional(),
});
export type CareLedgerQuery = z.infer<typeof careLedgerQuerySchema>;

const careTotalSchema = z.object({ currency: z.string(), count: z.number(), amountMinor: z.number() });

export const careLedgerResponseSchema = z.object({
  rows: z.array(z.object({
    id: z.number(), stationId: z.number(), station: z.string(), flightId: z.number(), serviceDate: z.string(), flight: z.string(), passengerName: z.string(),
    kind: careKindSchema, description: z.string(), amountMinor: z.number(), currency: z.string(), providedBy: z.string(), recordedAt: z.string(),
  })),
  /** Over every selected row (the list shows the newest 5,000). */
  totals: z.array(careTotalSchema),
  byKind: z.array(careTotalSchema.extend({ kind: careKindSchema })),
  byStation: z.array(careTotalSchema.extend({ stationId: z.number(), station: z.string() })),
  byFlight: z.array(careTotalSchema.extend({ flightId: z.number(), flight: z.string(), serviceDate: z.string(), station: z.string() })),
});
export type CareLedgerResponse = z.infer<typeof careLedgerResponseSchema>;
