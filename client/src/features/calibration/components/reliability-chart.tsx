import type { Calibration } from '@shared/schemas/learning';
import { formatPercent } from '../../../lib/format';

const SIZE = 280;
const PAD = 36;
const scale = (v: number) => PAD + v * (SIZE - 2 * PAD);
const flip = (v: number) => SIZE - scale(v);

/**
 * Predicted show probability against how often passengers showed, one dot per bin (area by passengers). Dots on the
 * dashed diagonal are well calibrated. The drawing is hidden from assistive technology: the table beside it holds
 * the same figures, and nothing in it takes focus.
 */
export function ReliabilityChart({ bins, caption }: { bins: Calibration['bins']; caption: string }) {
  const most = Math.max(1, ...bins.map((b) => b.count));
  return (
    <div className="grid items-start gap-4 md:grid-cols-[auto_1fr]">
      <svg aria-hidden="true" focusable="false" width={SIZE} height={SIZE} className="rounded border border-line bg-paper">
        <line x1={scale(0)} y1={flip(0)} x2={scale(1)} y2={flip(0)} stroke="var(--color-ink)" />
        <line x1={scale(0)} y1={flip(0)} x2={scale(0)} y2={flip(1)} stroke="var(--color-ink)" />
        <line x1={scale(0)} y1={flip(0)} x2={scale(1)} y2={flip(1)} stroke="var(--color-ink-soft)" strokeDasharray="6 5" />
        {[0, 0.5, 1].map((v) => (
          <g key={v}>
            <text x={scale(v)} y={SIZE - PAD + 16} fontSize="12" textAnchor="middle" fill="var(--color-ink)">{v * 100}%</text>
            <text x={PAD - 6} y={flip(v) + 4} fontSize="12" textAnchor="end" fill="var(--color-ink)">{v * 100}%</text>
          </g>
        ))}
        <text x={SIZE / 2} y={SIZE - 4} fontSize="12" textAnchor="middle" fill="var(--color-ink)">predicted</text>
        <text x={10} y={SIZE / 2} fontSize="12" textAnchor="middle" fill="var(--color-ink)" transform={`rotate(-90 10 ${SIZE / 2})`}>observed</text>
        {bins.map((b) => (
          <circle key={b.from} cx={scale(b.meanPredicted)} cy={flip(b.observedRate)} r={3 + 9 * Math.sqrt(b.count / most)} fill="var(--color-harbour)" fillOpacity="0.75" />
        ))}
      </svg>
      <table className="w-full text-left text-sm">
        <caption className="mb-1 text-left font-bold">{caption}</caption>
        <thead>
          <tr className="border-b-2 border-line">
            <th scope="col" className="py-1 pr-3">Predicted</th>
            <th scope="col" className="py-1 pr-3">Mean predicted</th>
            <th scope="col" className="py-1 pr-3">Showed</th>
            <th scope="col" className="py-1">Passengers</th>
          </tr>
        </thead>
        <tbody>
          {bins.map((b) => (
            <tr key={b.from} className="border-b border-line">
              <td className="py-1 pr-3">{Math.round(b.from * 100)}–{Math.round(b.to * 100)} %</td>
              <td className="py-1 pr-3">{formatPercent(b.meanPredicted)}</td>
              <td className="py-1 pr-3">{formatPercent(b.observedRate)}</td>
              <td className="py-1">{b.count}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
