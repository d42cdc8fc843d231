import { STATE_LABELS, type CompensationStateCode, type DeskCompensation } from '@shared/schemas/finance';

export type Tone = 'calm' | 'watch' | 'alert' | 'plain';

/** Every state in words and an icon, never colour alone. */
export const STATE_LOOK: Record<CompensationStateCode, { icon: string; text: string; tone: Tone; detail: string }> = {
  due: { icon: '◆', text: STATE_LABELS.due, tone: 'watch', detail: 'Not paid yet: pay it in the medium below before the passenger leaves the gate.' },
  issuing: { icon: '…', text: STATE_LABELS.issuing, tone: 'watch', detail: 'Sent to the payment provider; waiting for its answer.' },
  issued: { icon: '✓', text: STATE_LABELS.issued, tone: 'calm', detail: 'Paid: the card is ready for the passenger.' },
  settled: { icon: '✓', text: STATE_LABELS.settled, tone: 'calm', detail: 'Paid: handed over at the counter, or spent by the passenger.' },
  failed: { icon: '⚠', text: STATE_LABELS.failed, tone: 'alert', detail: 'The payment provider refused it. The passenger is still owed: re-issue it with a reason.' },
  voided: { icon: '⚠', text: STATE_LABELS.voided, tone: 'alert', detail: 'Finance voided the payment. The passenger is still owed: re-issue it with a reason.' },
  canceled: { icon: '⚠', text: STATE_LABELS.canceled, tone: 'alert', detail: 'The payment provider canceled the card. The passenger is still owed: re-issue it with a reason.' },
};

export const TONE_CLASS: Record<Tone, string> = {
  calm: 'border-calm bg-calm-soft text-calm',
  watch: 'border-watch bg-watch-soft text-watch',
  alert: 'border-alert bg-alert-soft text-alert',
  plain: 'border-line bg-paper text-ink-soft',
};

export function kindLabel(c: Pick<DeskCompensation, 'voluntary' | 'sourceKind'>): string {
  if (c.sourceKind === 'fee-refund') return 'Refund — optional fees paid for services not received, beside the compensation';
  if (c.sourceKind === 'cabin-refund') return 'Refund — flown in a lower class than the one paid, beside the compensation';
  return c.voluntary ? 'Voluntary — gave up the seat in a volunteer round' : 'Involuntary — denied boarding against their will';
}
