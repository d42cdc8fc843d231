import { CartesianGrid, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import { Button } from '../../../components/ui/button';
import { CellInput } from './cell-input';
import { curvePoints, rowId, type CurveRow, type DraftErrors, type ProfileDraft } from '../model/profile-draft';
import { ChartFrame } from '../../../components/ui/chart';

interface Props {
  draft: ProfileDraft;
  errors: DraftErrors;
  onChange: (curve: CurveRow[]) => void;
}

/** The points that read as numbers, drawn as the share of shows checked in against minutes before departure. */
function CurvePreview({ draft }: { draft: ProfileDraft }) {
  const points = curvePoints(draft).map((p) => ({ minutes: p.minutes, pct: p.share * 100 }));
  const close = Number(draft.checkInCloseMinutes);
  if (points.length < 2) return <p className="text-ink-soft">The preview appears once two points read as numbers.</p>;
  return (
    <figure className="min-w-0">
      <figcaption className="mb-1 font-bold">Preview: share of shows checked in</figcaption>
      <p className="sr-only">
        From {Math.round(points[0].pct)} % at {points[0].minutes} minutes before departure to {Math.round(points[points.length - 1].pct)} % at {points[points.length - 1].minutes} minutes.
      </p>
      <ChartFrame testId="check-in-curve-chart">
        <LineChart data={points} responsive style={{ width: '100%', height: 220 }} margin={{ top: 16, right: 24, bottom: 22, left: 0 }}>
          <CartesianGrid stroke="var(--color-line)" />
          <XAxis
            dataKey="minutes"
            type="number"
            reversed
            // A square-root scale gives the last hours, where most check-in happens, room to be read.
            scale="sqrt"
            domain={[0, 'dataMax']}
            ticks={points.map((p) => p.minutes)}
            tick={{ fill: 'var(--color-ink)', fontSize: 14 }}
            label={{ value: 'Minutes before departure', position: 'insideBottom', offset: -14, fill: 'var(--color-ink)', fontSize: 14 }}
          />
          <YAxis domain={[0, 100]} tickFormatter={(v: number) => `${v} %`} tick={{ fill: 'var(--color-ink)', fontSize: 14 }} width={56} />
          <Tooltip formatter={(v) => [`${Number(v).toFixed(0)} %`, 'Checked in']} labelFormatter={(m) => `${m} min before departure`} contentStyle={{ fontSize: 16, borderWidth: 2 }} />
          {Number.isFinite(close) && close > 0 && (
            <ReferenceLine x={close} stroke="var(--color-ink)" strokeDasharray="6 4" strokeWidth={2} label={{ value: 'Check-in closes', position: 'insideBottomRight', fill: 'var(--color-ink)', fontSize: 13, fontWeight: 700 }} />
          )}
          <Line type="linear" dataKey="pct" stroke="var(--color-harbour)" strokeWidth={3} dot={{ r: 4 }} isAnimationActive={false} />
        </LineChart>
      </ChartFrame>
    </figure>
  );
}

/** The check-in curve as an editable table, one point per row, with the chart beside it. */
export function CheckInCurveEditor({ draft, errors, onChange }: Props) {
  const set = (id: string, patch: Partial<CurveRow>) => onChange(draft.curve.map((c) => (c.id === id ? { ...c, ...patch } : c)));
  return (
    <fieldset className="space-y-2">
      <legend className="text-lg font-bold">Check-in curve</legend>
      <p className="text-sm text-ink-soft">
        Of the people who will show, the share already checked in at each time before departure. List the points from the most minutes to the fewest; the shares must never fall.
      </p>
      <div className="grid items-start gap-4 xl:grid-cols-[auto_1fr]">
        <div>
          <table>
            <caption className="sr-only">Check-in curve points</caption>
            <thead className="bg-harbour-soft text-left">
              <tr>
                <th scope="col" className="px-2 py-2">Minutes before departure</th>
                <th scope="col" className="px-2 py-2">Share checked in</th>
                <th scope="col" className="px-2 py-2"><span className="sr-only">Remove</span></th>
              </tr>
            </thead>
            <tbody>
              {draft.curve.map((c, i) => (
                <tr key={c.id} className="border-t border-line align-top">
                  <td className="px-2 py-1">
                    <CellInput label={`Point ${i + 1}: minutes before departure`} inputMode="numeric" value={c.minutes} onChange={(v) => set(c.id, { minutes: v })} error={errors[`checkInCurve.${i}.0`]} />
                  </td>
                  <td className="px-2 py-1">
                    <CellInput label={`Point ${i + 1}: share checked in`} value={c.share} onChange={(v) => set(c.id, { share: v })} error={errors[`checkInCurve.${i}.1`]} />
                  </td>
                  <td className="px-2 py-1">
                    <Button type="button" variant="quiet" aria-label={`Remove point ${i + 1}`} disabled={draft.curve.length <= 2} onClick={() => onChange(draft.curve.filter((x) => x.id !== c.id))}>
                      Remove
                    </Button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {errors.checkInCurve && <p className="mt-1 max-w-md font-bold text-alert">{errors.checkInCurve}</p>}
          <Button type="button" variant="secondary" className="mt-2" onClick={() => onChange([...draft.curve, { id: rowId(), minutes: '', share: '' }])}>
            Add a point
          </Button>
        </div>
        <CurvePreview draft={draft} />
      </div>
    </fieldset>
  );
}
