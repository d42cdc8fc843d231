// The passenger's own payment pages: a prepaid card's details shown once, and the bank account a transfer goes to.
// Both are reached from a single-use link mailed to the passenger; both ask for the booking proof first.
import { z } from 'zod';
import { LANGUAGES } from '../i18n/languages';

/** ABA routing number check digit: 3·d1 + 7·d2 + d3 + 3·d4 + 7·d5 + d6 + 3·d7 + 7·d8 + d9 ≡ 0 (mod 10) (from memory). */
export function abaRoutingValid(routing: string): boolean {
  if (!/^\d{9}$/.test(routing)) return false;
  const weights = [3, 7, 1, 3, 7, 1, 3, 7, 1];
  return [...routing].reduce((sum, d, i) => sum + Number(d) * weights[i], 0) % 10 === 0;
}

const digitsOnly = (v: string) => v.replace(/[\s-]/g, '');

export const bookingProofSchema = z.object({
  pnr: z.string().trim().toUpperCase().regex(/^[A-Z0-9]{5,8}$/, 'booking reference must be 5-8 letters or digits'),
  lastName: z.string().trim().min(1, 'last name is required').max(60, 'last name must be at most 60 characters'),
});
export type BookingProof = z.infer<typeof bookingProofSchema>;

export const LINK_STATES = ['ready', 'used', 'expired', 'locked'] as const;

/** What the link's page may know before the proof: never the card's or the account's numbers. */
export const cardDetailsLinkSchema = z.object({
  state: z.enum(LINK_STATES),
  flight: z.string(),
  amountMinor: z.number().int(),
  currency: z.string(),
  expiresAt: z.string(),
  /** The booking's language, so the page opens in it unless the passenger picks another; null when not known. */
  language: z.enum(LANGUAGES).nullable().optional(),
});
export type CardDetailsLink = z.infer<typeof cardDetailsLinkSchema>;

export const cardDetailsSchema = z.object({
  number: z.string().regex(/^\d{12,19}$/),
  cvc: z.string().regex(/^\d{3,4}$/),
  expMonth: z.number().int().min(1).max(12),
  expYear: z.number().int(),
  amountMinor: z.number().int(),
  currency: z.string(),
});
export type CardDetails = z.infer<typeof cardDetailsSchema>;

export const PAYOUT_STATES = ['awaiting-details', 'ready', 'processing', 'posted', 'failed', 'returned'] as const;

export const payoutLinkSchema = z.object({
  state: z.enum(LINK_STATES),
  flight: z.string(),
  amountMinor: z.number().int(),
  currency: z.string(),
  expiresAt: z.string(),
  payout: z.object({ state: z.enum(PAYOUT_STATES), accountEnding: z.string().nullable() }).nullable(),
  /** The booking's language, so the page opens in it unless the passenger picks another; null when not known. */
  language: z.enum(LANGUAGES).nullable().optional(),
});
export type PayoutLink = z.infer<typeof payoutLinkSchema>;

export const payoutDetailsBodySchema = bookingProofSchema
  .extend({
    holderName: z.string().trim().min(2, 'account holder name is required').max(80, 'account holder name must be at most 80 characters'),
    routingNumber: z.string().transform(digitsOnly).refine(abaRoutingValid, 'routing number must be the 9 digits printed on your cheques, with a valid check digit'),
    accountNumber: z.string().transform(digitsOnly).pipe(z.string().regex(/^\d{4,17}$/, 'account number must be 4 to 17 digits')),
    accountNumberAgain: z.string().transform(digitsOnly),
    accountType: z.enum(['checking', 'savings'], { error: 'account type must be checking or savings' }),
  })
  .refine((b) => b.accountNumber === b.accountNumberAgain, { message: 'the two account numbers must be the same', path: ['accountNumberAgain'] });
export type PayoutDetailsBody = z.input<typeof payoutDetailsBodySchema>;

export const payoutAcceptedSchema = z.object({ accountEnding: z.string(), state: z.enum(PAYOUT_STATES) });
