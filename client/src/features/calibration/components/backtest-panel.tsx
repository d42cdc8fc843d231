import type { Calibration } from '@shared/schemas/learning';
import { formatPercent } from '../../../lib/format';

type Backtest = Calibration['backtest']['learned'];
const W = 280;
const H = 150;

/** Bars of expected against actual people beyond the seats; hidden from assistive technology (the table says it). */
function DenialBars({ learned, handSet }: { learned: Backtest; handSet: Backtest }) {
  const rows = [
    { label: 'learned, expected', value: learned.expectedDenied, colour: 'var(--color-harbour)' },
    { label: 'hand-set, expected', value: handSet.expectedDenied, colour: 'var(--color-ink-soft)' },
    { label: 'actual', value: learned.actualDenied, colour: 'var(--color-alert)' },
  ];
  const most = Math.max(1, ...rows.map((r) => r.value));
  return (
    <svg aria-hidden="true" focusable="false" width={W} height={H} className="rounded border border-line bg-paper">
      {rows.map((r, i) => (
        <g key={r.label}>
          <text x={8} y={30 + i * 42} fontSize="12" fill="var(--color-ink)">{r.label}</text>
          <rect x={8} y={36 + i * 42} height={12} width={Math.max(1, (r.value / most) * (W - 70))} fill={r.colour} />
          <text x={14 + Math.max(1, (r.value / most) * (W - 70))} y={47 + i * 42} fontSize="12" fill="var(--color-ink)">{r.value.toFixed(1)}</text>
        </g>
      ))}
    </svg>
  );
}

/** The oversale odds on flights held out of training, for the learned rates and the hand-set profile. */
export function BacktestPanel({ backtest }: { backtest: Calibration['backtest'] }) {
  const { learned, handSet } = backtest;
  const row = (label: string, l: string, h: string) => (
    <tr className="border-b border-line">
      <th scope="row" className="py-1 pr-3 text-left font-normal">{label}</th>
      <td className="py-1 pr-3">{l}</td>
      <td className="py-1">{h}</td>
    </tr>
  );
  return (
    <div className="grid items-start gap-4 md:grid-cols-[auto_1fr]">
      <DenialBars learned={learned} handSet={handSet} />
      <table className="w-full text-left text-sm">
        <caption className="mb-1 text-left font-bold">Oversale odds on {learned.flights} held-out flights, three hours before departure</caption>
        <thead>
          <tr className="border-b-2 border-line">
            <th scope="col" className="py-1 pr-3">Figure</th>
            <th scope="col" className="py-1 pr-3">Learned rates</th>
            <th scope="col" className="py-1">Hand-set profile</th>
          </tr>
        </thead>
        <tbody>
          {row('Mean predicted chance of an oversale', formatPercent(learned.meanPredicted), formatPercent(handSet.meanPredicted))}
          {row('Flights that were oversold', formatPercent(learned.observedRate), formatPercent(handSet.observedRate))}
          {row('Brier score of the oversale odds', learned.brier.toFixed(4), handSet.brier.toFixed(4))}
          {row('Expected people beyond the seats', learned.expectedDenied.toFixed(1), handSet.expectedDenied.toFixed(1))}
          {row('Actual people beyond the seats', String(learned.actualDenied), String(handSet.actualDenied))}
        </tbody>
      </table>
    </div>
  );
}
