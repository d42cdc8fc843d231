// Optional fees a passenger paid on top of the fare (seat selection, bags, priority…): carried by the manifest and the
// feed, stored on the passenger, and refunded when the rule says a denied passenger did not receive the service.
import { z } from 'zod';
import { minorAmountSchema } from './money';

export const OPTIONAL_FEE_KINDS = ['seat', 'bag', 'priority', 'meal', 'wifi', 'lounge', 'other'] as const;
export type OptionalFeeKind = (typeof OPTIONAL_FEE_KINDS)[number];

/** A booking rarely carries more than a few paid extras per passenger; the cap keeps a bad feed from storing thousands. */
export const MAX_OPTIONAL_FEES = 12;

export const optionalFeeSchema = z.object({
  kind: z.enum(OPTIONAL_FEE_KINDS, { error: `kind must be one of ${OPTIONAL_FEE_KINDS.join(', ')}` }),
  amountMinor: minorAmountSchema('amountMinor'),
  currency: z.string().regex(/^[A-Z]{3}$/, 'currency must be a three-letter ISO 4217 code'),
});
export type OptionalFee = z.infer<typeof optionalFeeSchema>;

export const optionalFeesSchema = z.array(optionalFeeSchema).max(MAX_OPTIONAL_FEES, `at most ${MAX_OPTIONAL_FEES} optional fees per passenger`);

/** The manifest's `optional_fees` cell: "seat:3500:USD; bag:4000:USD" (our own layout); empty means none. */
export const OPTIONAL_FEES_CELL_EXAMPLE = 'seat:3500:USD; bag:4000:USD';
const FEE_TEXT = /^([a-z]+):(\d+):([A-Z]{3})$/;

export const optionalFeesCellSchema = z
  .string()
  .trim()
  .transform((text, ctx) => {
    if (text === '') return [];
    const fees: OptionalFee[] = [];
    for (const [i, part] of text.split(';').map((p) => p.trim()).entries()) {
      const m = FEE_TEXT.exec(part.replace(/\s+/g, '').replace(/^[A-Za-z]+/, (k) => k.toLowerCase()).replace(/[a-z]{3}$/, (c) => c.toUpperCase()));
      if (!m) {
        ctx.addIssue({ code: 'custom', message: `optional_fees fee ${i + 1} must read like "seat:3500:USD" (kind:minor units:currency)` });
        return z.NEVER;
      }
      const parsed = optionalFeeSchema.safeParse({ kind: m[1], amountMinor: Number(m[2]), currency: m[3] });
      if (!parsed.success) {
        ctx.addIssue({ code: 'custom', message: `optional_fees fee ${i + 1}: ${parsed.error.issues[0].message}` });
        return z.NEVER;
      }
      fees.push(parsed.data);
    }
    return fees;
  })
  .pipe(optionalFeesSchema);

/** The cell text of a passenger's fees, the inverse of optionalFeesCellSchema. */
export function optionalFeesCell(fees: readonly OptionalFee[] | null | undefined): string {
  return (fees ?? []).map((f) => `${f.kind}:${f.amountMinor}:${f.currency}`).join('; ');
}

/** Fees are refunded with the fare's other refunds in one payment: each must be in the fare's currency. */
export function feeCurrencyProblem(fees: readonly OptionalFee[], fareCurrency: string): { index: number; rule: string } | null {
  const index = fees.findIndex((f) => f.currency !== fareCurrency);
  return index < 0 ? null : { index, rule: `must be the fare's currency ${fareCurrency} (fee ${index + 1} is in ${fees[index].currency})` };
}
