/** "2026-Q4" -> the first and last calendar day of that quarter. Calendar quarters end on March 31, June 30,
 * September 30 and December 31 (14 CFR 250.10). */
export function quarterRange(quarter: string): { from: string; to: string } {
  const match = /^(\d{4})-Q([1-4])$/.exec(quarter);
  if (!match) throw new RangeError(`quarter: expected a quarter such as 2026-Q4, got ${JSON.stringify(quarter)}`);
  const year = Number(match[1]);
  const firstMonth = (Number(match[2]) - 1) * 3;
  // Day 0 of the month after the quarter is the quarter's last day.
  const from = new Date(Date.UTC(year, firstMonth, 1));
  const to = new Date(Date.UTC(year, firstMonth + 3, 0));
  return { from: from.toISOString().slice(0, 10), to: to.toISOString().slice(0, 10) };
}
