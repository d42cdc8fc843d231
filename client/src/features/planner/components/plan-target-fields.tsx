import { TextField } from '../../../components/ui/text-field';
import type { TargetFieldName, TargetFields, TargetKind } from '../model/plan-target';

interface Props {
  origin: string;
  value: TargetFields;
  onChange: (next: TargetFields) => void;
  errors: Partial<Record<TargetFieldName, string>>;
}

const KINDS: { kind: TargetKind; label: string }[] = [
  { kind: 'route', label: 'A route' },
  { kind: 'flight', label: 'A future flight' },
];

/** Route or flight: the origin is the station itself, since a station plans its own departures. */
export function PlanTargetFields({ origin, value, onChange, errors }: Props) {
  const set = (patch: Partial<TargetFields>) => onChange({ ...value, ...patch });
  return (
    <div className="space-y-3">
      <fieldset>
        <legend className="mb-1 font-bold">Plan for</legend>
        <div className="flex flex-wrap gap-2">
          {KINDS.map((k) => (
            <label key={k.kind} className={`flex min-h-11 cursor-pointer items-center gap-2 rounded-md border-2 px-3 py-2 font-bold ${value.kind === k.kind ? 'border-harbour bg-harbour-soft' : 'border-line bg-card'}`}>
              <input type="radio" name="plan-kind" className="h-5 w-5" checked={value.kind === k.kind} onChange={() => set({ kind: k.kind })} />
              {k.label}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="grid grid-cols-[auto_1fr] items-start gap-3">
        <div>
          <p className="mb-1 font-bold">From</p>
          <p className="rounded-md border-2 border-line bg-paper px-3 py-2 text-lg font-bold">{origin}</p>
        </div>
        <TextField label="To (IATA code)" value={value.destination} onChange={(v) => set({ destination: v.toUpperCase() })} error={errors.destination} maxLength={3} autoComplete="off" placeholder="e.g. ORD" />
      </div>
      {value.kind === 'flight' && (
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField label="Flight" value={value.designator} onChange={(v) => set({ designator: v.toUpperCase() })} error={errors.designator} autoComplete="off" placeholder="e.g. BB123" />
          <TextField label="Departure date (local)" type="date" value={value.date} onChange={(v) => set({ date: v })} error={errors.date} />
        </div>
      )}
    </div>
  );
}
