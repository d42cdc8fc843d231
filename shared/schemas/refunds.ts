// Refunds the rules add to a denied passenger's compensation, as the desk and finance see them.
import { z } from 'zod';
import { compensationStateSchema } from './finance';
import { mediumSchema } from './payment-media';

export const RULE_REFUND_KINDS = ['optional-fees', 'downgrade'] as const;
export type RuleRefundKind = (typeof RULE_REFUND_KINDS)[number];
export const RULE_REFUND_LABELS: Record<RuleRefundKind, string> = { 'optional-fees': 'Optional fees not received', downgrade: 'Downgrade' };

/** The payment rows that carry refunds, by the kind of refund they pay. */
export const REFUND_SOURCE_KINDS = { 'optional-fees': 'fee-refund', downgrade: 'cabin-refund' } as const satisfies Record<RuleRefundKind, string>;
export const REFUND_PAYMENT_KINDS = Object.values(REFUND_SOURCE_KINDS);
export const isRefundPayment = (sourceKind: string) => (REFUND_PAYMENT_KINDS as readonly string[]).includes(sourceKind);

/** "Refund: optional fees not received" for a refund's payment row; null for a compensation. */
export function refundKindLabel(sourceKind: string): string | null {
  const kind = RULE_REFUND_KINDS.find((k) => REFUND_SOURCE_KINDS[k] === sourceKind);
  return kind ? `Refund: ${RULE_REFUND_LABELS[kind].toLowerCase()}` : null;
}

export const ruleRefundViewSchema = z.object({
  id: z.number(),
  flightId: z.number(),
  passengerId: z.number(),
  passengerName: z.string(),
  kind: z.enum(RULE_REFUND_KINDS),
  amountMinor: z.number(),
  currency: z.string(),
  ruleRef: z.string(),
  lines: z.array(z.object({ label: z.string(), amountMinor: z.number() })),
  /** The compensation it goes with, and the payment row that pays it (issued from the desk like the compensation). */
  baseCompensationId: z.number(),
  paymentCompensationId: z.number(),
  paymentState: compensationStateSchema,
  medium: mediumSchema,
  createdAt: z.string(),
});
export type RuleRefundView = z.infer<typeof ruleRefundViewSchema>;
export const ruleRefundsResponseSchema = z.object({ refunds: z.array(ruleRefundViewSchema) });
