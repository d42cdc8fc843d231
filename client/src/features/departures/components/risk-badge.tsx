import { formatPercent } from '../../../lib/format';

/** Risk in words and a shape as well as colour, so it reads on a monochrome display and for colour-blind staff. */
export function RiskBadge({ p }: { p: number | null }) {
  if (p === null) return <span className="text-ink-soft">not computed</span>;
  const level = p >= 0.25 ? 'high' : p >= 0.05 ? 'watch' : 'low';
  const look = {
    high: { cls: 'bg-alert-soft text-alert border-alert', icon: '▲', word: 'High' },
    watch: { cls: 'bg-watch-soft text-watch border-watch', icon: '◆', word: 'Watch' },
    low: { cls: 'bg-calm-soft text-calm border-calm', icon: '●', word: 'Low' },
  }[level];
  return (
    <span className={`inline-flex items-center gap-1 rounded border px-2 py-0.5 font-bold ${look.cls}`}>
      <span aria-hidden>{look.icon}</span>
      {look.word} {formatPercent(p)}
    </span>
  );
}
