import type { Calibration } from '@shared/schemas/learning';

const signed = (v: number) => `${v > 0 ? '+' : v < 0 ? '−' : '±'}${Math.abs(v).toFixed(4)}`;

/** Brier score and log loss of the show probabilities, learned against hand-set; lower is better for both. */
export function ScoresTable({ c }: { c: Calibration }) {
  const rows = [
    { name: 'Brier score', learned: c.learned.brier, hand: c.handSet.brier },
    { name: 'Log loss', learned: c.learned.logLoss, hand: c.handSet.logLoss },
  ];
  return (
    <table className="w-full text-left text-sm">
      <caption className="mb-1 text-left font-bold">Show probabilities of {c.passengers} held-out passengers (lower is better)</caption>
      <thead>
        <tr className="border-b-2 border-line">
          <th scope="col" className="py-1 pr-3">Score</th>
          <th scope="col" className="py-1 pr-3">Learned rates</th>
          <th scope="col" className="py-1 pr-3">Hand-set profile</th>
          <th scope="col" className="py-1">Change</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.name} className="border-b border-line">
            <th scope="row" className="py-1 pr-3 font-normal">{r.name}</th>
            <td className="py-1 pr-3">{r.learned.toFixed(4)}</td>
            <td className="py-1 pr-3">{r.hand.toFixed(4)}</td>
            <td className="py-1 font-bold">{signed(r.learned - r.hand)}{r.learned < r.hand ? ' (better)' : r.learned > r.hand ? ' (worse)' : ''}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
