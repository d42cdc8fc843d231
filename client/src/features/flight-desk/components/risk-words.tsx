import { formatPercent } from '../../../lib/format';
import { RISK_LOOK, riskLevel } from '../model/risk';

/** A risk as a badge: icon, word and percentage, never colour alone. */
export function RiskWords({ p, showPercent = true, className = '' }: { p: number; showPercent?: boolean; className?: string }) {
  const look = RISK_LOOK[riskLevel(p)];
  return (
    <span className={`inline-flex items-center gap-1.5 rounded border-2 px-2 py-0.5 font-bold ${look.badge} ${className}`}>
      <span aria-hidden>{look.icon}</span>
      {look.word}
      {showPercent && ` ${formatPercent(p)}`}
    </span>
  );
}
