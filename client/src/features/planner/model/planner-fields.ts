import { plannerInputSchema, type PlannerInput } from '@shared/schemas/planner';
import { minorToText, parseMoneyText } from './money-text';

/** What the planner typed, kept as text so an invalid entry is never lost or rewritten. */
export interface PlannerFields {
  capacity: string;
  showRate: string;
  revenue: string;
  costPerDenial: string;
  rho: string;
}

export type PlannerFieldName = keyof PlannerFields;

export const EMPTY_FIELDS: PlannerFields = { capacity: '', showRate: '', revenue: '', costPerDenial: '', rho: '' };

export const FIELD_LABELS: Record<PlannerFieldName, string> = {
  capacity: 'Seats',
  showRate: 'Show rate',
  revenue: 'Revenue per booking',
  costPerDenial: 'Cost per denied boarding',
  rho: 'Show-up correlation (rho)',
};

const SCHEMA_KEY_TO_FIELD: Record<string, PlannerFieldName> = {
  capacity: 'capacity',
  showProbability: 'showRate',
  revenuePerBookingMinor: 'revenue',
  costPerDenialMinor: 'costPerDenial',
  rho: 'rho',
};

export type PlannerCheck =
  | { ok: true; input: PlannerInput }
  | { ok: false; errors: Partial<Record<PlannerFieldName | 'form', string>> };

/** Empty is undefined (the schema then says "required"); anything else unreadable stays NaN ("must be a number"). */
function numberText(text: string): number | undefined {
  const trimmed = text.trim();
  return trimmed === '' ? undefined : Number(trimmed);
}

/** "0.9", "0,9" and "90 %" all mean a show rate of 0.9. */
export function parseShowRate(text: string): number | undefined {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed.endsWith('%')) {
    const percent = numberText(trimmed.slice(0, -1));
    return percent === undefined ? Number.NaN : percent / 100;
  }
  return numberText(trimmed);
}

/** The schema speaks in API keys ("showProbability must be at most 1"); the form says the label instead. */
function reworded(message: string, schemaKey: string, field: PlannerFieldName): string {
  const lead = new RegExp(`^${schemaKey}( \\([^)]*\\))?`);
  return lead.test(message) ? message.replace(lead, FIELD_LABELS[field]) : message;
}

/** Checks the typed fields with the shared planner schema, the same one the server applies on save. */
export function checkPlannerFields(fields: PlannerFields, currency: string): PlannerCheck {
  const errors: Partial<Record<PlannerFieldName | 'form', string>> = {};
  const revenue = parseMoneyText(fields.revenue, currency, FIELD_LABELS.revenue);
  const cost = parseMoneyText(fields.costPerDenial, currency, FIELD_LABELS.costPerDenial);
  if (!revenue.ok) errors.revenue = revenue.message;
  if (!cost.ok) errors.costPerDenial = cost.message;
  const candidate = {
    capacity: numberText(fields.capacity),
    showProbability: parseShowRate(fields.showRate),
    revenuePerBookingMinor: revenue.ok ? revenue.minor : 0,
    costPerDenialMinor: cost.ok ? cost.minor : 0,
    currency,
    ...(fields.rho.trim() === '' ? {} : { rho: numberText(fields.rho.replace(',', '.')) }),
  };
  const parsed = plannerInputSchema.safeParse(candidate);
  if (parsed.success && Object.keys(errors).length === 0) return { ok: true, input: parsed.data };
  for (const issue of parsed.success ? [] : parsed.error.issues) {
    const key = String(issue.path[0] ?? '');
    const field = SCHEMA_KEY_TO_FIELD[key];
    if (field) errors[field] ??= reworded(issue.message, key, field);
    else errors.form ??= issue.message;
  }
  return { ok: false, errors };
}

/** Saved inputs back into form text, for reopening a plan. */
export function fieldsFromInput(input: PlannerInput): PlannerFields {
  return {
    capacity: String(input.capacity),
    showRate: String(input.showProbability),
    revenue: minorToText(input.revenuePerBookingMinor, input.currency),
    costPerDenial: minorToText(input.costPerDenialMinor, input.currency),
    rho: input.rho === undefined ? '' : String(input.rho),
  };
}

/** Maps a server field path ("inputs.showProbability") to the form field showing it. */
export function fieldForServerPath(path: string): PlannerFieldName | undefined {
  return path.startsWith('inputs.') ? SCHEMA_KEY_TO_FIELD[path.slice('inputs.'.length)] : undefined;
}
