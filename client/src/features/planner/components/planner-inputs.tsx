import type { ReactNode } from 'react';
import { TextField } from '../../../components/ui/text-field';
import { FIELD_LABELS, type PlannerFieldName, type PlannerFields } from '../model/planner-fields';

interface Props {
  currency: string;
  value: PlannerFields;
  onChange: (field: PlannerFieldName, text: string) => void;
  onBlur: (field: PlannerFieldName) => void;
  errors: Partial<Record<PlannerFieldName, string>>;
  /** Shown under the cost field: the helper that builds the cost from the station's rules. */
  costHelper: ReactNode;
}

const HINTS: Record<PlannerFieldName, string> = {
  capacity: 'Physical seats you can sell on the flight.',
  showRate: 'Share of bookings that turn up at the gate: 0.90 or 90 %.',
  revenue: 'Net revenue one more booking brings in.',
  costPerDenial: 'Full cost of one passenger left behind: compensation, rebooking and goodwill.',
  rho: 'Optional. Leave empty when passengers show up independently; 0.01 to 0.05 when weather or a late connection moves many at once.',
};

export function PlannerInputs({ currency, value, onChange, onBlur, errors, costHelper }: Props) {
  const field = (name: PlannerFieldName, extra: { label?: string; inputMode?: 'numeric' | 'decimal'; placeholder?: string }) => (
    <TextField
      label={extra.label ?? FIELD_LABELS[name]}
      value={value[name]}
      onChange={(v) => onChange(name, v)}
      onBlur={() => onBlur(name)}
      error={errors[name]}
      hint={HINTS[name]}
      inputMode={extra.inputMode ?? 'decimal'}
      placeholder={extra.placeholder}
      autoComplete="off"
    />
  );
  return (
    <div className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-2">
        {field('capacity', { inputMode: 'numeric', placeholder: 'e.g. 150' })}
        {field('showRate', { placeholder: 'e.g. 0.90' })}
      </div>
      {field('revenue', { label: `${FIELD_LABELS.revenue} (${currency})`, placeholder: 'e.g. 200.00' })}
      <div className="space-y-2">
        {field('costPerDenial', { label: `${FIELD_LABELS.costPerDenial} (${currency})`, placeholder: 'e.g. 400.00' })}
        {costHelper}
      </div>
      {field('rho', { placeholder: 'empty: independent' })}
    </div>
  );
}
