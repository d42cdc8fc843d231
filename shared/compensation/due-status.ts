// Where a payment stands against its deadline. "Due soon" starts two hours before: long enough for a desk to pay at
// the counter or a transfer to be sent. Common practice, no outside source.
export const DUE_SOON_MINUTES = 120;
export type DueStatus = 'overdue' | 'due-soon' | 'in-time';

export function dueStatus(dueBy: string | Date | null, now: Date): DueStatus | null {
  if (dueBy === null) return null;
  const left = new Date(dueBy).getTime() - now.getTime();
  if (Number.isNaN(left)) throw new RangeError(`dueBy: not a date-time: ${String(dueBy)}`);
  if (left < 0) return 'overdue';
  return left <= DUE_SOON_MINUTES * 60_000 ? 'due-soon' : 'in-time';
}
