/**
 * The top of a percentage scale: a little above the highest point and the target, on a round step, so odds of a
 * few percent still make a visible line instead of hugging the floor of a 0-100 chart.
 */
export function percentScaleTop(maxPct: number, targetPct: number) {
  const need = Math.max(maxPct, targetPct) * 1.2;
  const step = need <= 10 ? 2 : need <= 50 ? 10 : 25;
  return Math.min(100, Math.max(step, Math.ceil(need / step) * step));
}
