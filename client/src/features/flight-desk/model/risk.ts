// Risk in words and a shape as well as colour, so it reads on a monochrome display and for colour-blind staff.
// The thresholds match the departures board, so a flight reads the same on both screens.
export type RiskLevel = 'high' | 'watch' | 'low';

export const HIGH_RISK_FROM = 0.25;
export const WATCH_RISK_FROM = 0.05;

export function riskLevel(p: number): RiskLevel {
  if (p >= HIGH_RISK_FROM) return 'high';
  if (p >= WATCH_RISK_FROM) return 'watch';
  return 'low';
}

export const RISK_LOOK: Record<RiskLevel, { word: string; icon: string; badge: string; text: string; panel: string }> = {
  high: { word: 'High risk', icon: '▲', badge: 'bg-alert-soft text-alert border-alert', text: 'text-alert', panel: 'border-alert bg-alert-soft' },
  watch: { word: 'Watch', icon: '◆', badge: 'bg-watch-soft text-watch border-watch', text: 'text-watch', panel: 'border-watch bg-watch-soft' },
  low: { word: 'Low risk', icon: '●', badge: 'bg-calm-soft text-calm border-calm', text: 'text-calm', panel: 'border-calm bg-calm-soft' },
};

/** A tolerance as people say it: 0.05 is "5 %", 0.025 is "2.5 %". */
export function formatTolerance(p: number) {
  return `${Number((p * 100).toFixed(1))} %`;
}
