// Which refunds the station's rule adds to a denied passenger's compensation, from what the booking carries (the
// optional fees paid) and what the desk recorded (a downgrade). Pure, so the amounts can be checked against the text.
import { optionalFeeRefund } from '@shared/compensation';
import type { RegimeCode } from '@shared/schemas/common';
import type { OptionalFee, OptionalFeeKind } from '@shared/schemas/optional-fees';
import type { RuleRefundKind } from '@shared/schemas/refunds';

export const FEE_LABELS: Record<OptionalFeeKind, string> = {
  seat: 'Seat selection', bag: 'Checked bag', priority: 'Priority boarding', meal: 'Meal', wifi: 'Wi-Fi', lounge: 'Lounge', other: 'Other extra',
};

export interface RecordedDowngrade {
  id: number;
  direction: 'upgrade' | 'downgrade';
  /** What the desk's rule computed when the change was recorded (Art. 10(2) share, or the fare difference). */
  owedMinor: number;
  owedRule: string;
  currency: string;
}

export interface RefundDue {
  kind: RuleRefundKind;
  amountMinor: number;
  currency: string;
  ruleRef: string;
  lines: { label: string; amountMinor: number }[];
  cabinChangeId: number | null;
}

/**
 * A denied passenger did not fly the original flight, so none of its paid extras was received there. Whether the
 * alternate gave them again is not known here; the agent can void a refund line's payment with a reason when it did.
 */
export function refundsDue(input: { regime: RegimeCode; fareCurrency: string; fees: readonly OptionalFee[]; cabinChange: RecordedDowngrade | null }): RefundDue[] {
  const due: RefundDue[] = [];
  const fees = optionalFeeRefund({
    regime: input.regime, currency: input.fareCurrency,
    fees: input.fees.filter((f) => f.currency === input.fareCurrency).map((f) => ({ kind: f.kind, amountMinor: f.amountMinor, received: false })),
  });
  if (fees.amountMinor > 0) {
    due.push({
      kind: 'optional-fees', amountMinor: fees.amountMinor, currency: fees.currency, ruleRef: fees.ruleRef, cabinChangeId: null,
      lines: fees.lines.map((l) => ({ label: FEE_LABELS[l.kind as OptionalFeeKind] ?? l.kind, amountMinor: l.amountMinor })),
    });
  }
  const cc = input.cabinChange;
  if (cc && cc.direction === 'downgrade' && cc.owedMinor > 0) {
    due.push({ kind: 'downgrade', amountMinor: cc.owedMinor, currency: cc.currency, ruleRef: cc.owedRule, cabinChangeId: cc.id, lines: [{ label: 'Downgrade', amountMinor: cc.owedMinor }] });
  }
  return due;
}
