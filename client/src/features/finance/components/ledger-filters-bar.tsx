import { useId, useState } from 'react';
import { COMPENSATION_STATES, STATE_LABELS } from '@shared/schemas/finance';
import { REGIMES, REGIME_LABELS } from '@shared/schemas/common';
import { MEDIA } from '@shared/compensation/media';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
import { ledgerQuerySchema } from '@shared/schemas/finance';
import { FormProblems, issueProblems, type FieldProblem } from '../../../components/ui/form-problems';
import { ledgerQueryString, withFilter, type LedgerFilters } from '../model/ledger-filters';
import { DateField, SelectField, type StationOption } from './field';

const LABELS: Record<string, string> = { stationId: 'Station', from: 'Flights from', to: 'Flights to', regime: 'Regime', state: 'State', medium: 'Medium', due: 'Deadline' };

/** What the server would refuse in these filters, checked with the same schema before asking. */
const refusedFilters = (f: LedgerFilters): FieldProblem[] => {
  const parsed = ledgerQuerySchema.safeParse(Object.fromEntries(new URLSearchParams(ledgerQueryString(f, true))));
  // The schema names the other date by its code name; the summary uses the label the screen shows.
  return parsed.success ? [] : issueProblems(parsed.error.issues).map((p) => ({ ...p, rule: p.rule.replace(/ from$/, ' “Flights from”') }));
};

/**
 * The ledger's filters apply as they change. One the server would refuse is kept on screen as typed (nothing lost),
 * not applied, and named in the error summary: announced as it happens, and focused when Enter is pressed in the form.
 */
export function LedgerFiltersBar({ stations, filters: applied, onChange }: { stations: StationOption[]; filters: LedgerFilters; onChange: (f: LedgerFilters) => void }) {
  const [draft, setDraft] = useState<LedgerFilters | null>(null);
  const [refused, setRefused] = useState<FieldProblem[] | null>(null);
  const [focusSummary, setFocusSummary] = useState(false);
  const id = useId();
  const ids = { from: `${id}-from`, to: `${id}-to` };
  const filters = draft ?? applied;
  const apply = (next: LedgerFilters) => {
    const problems = refusedFilters(next);
    setFocusSummary(false);
    if (problems.length) {
      setDraft(next);
      return setRefused(problems);
    }
    setDraft(null);
    setRefused(null);
    onChange(next);
  };
  return (
    <form
      role="search"
      aria-label="Filter the ledger"
      className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4"
      onSubmit={(e) => e.preventDefault()}
      // The form has no submit button and several fields, so the browser submits nothing on Enter: Enter is read here.
      onKeyDown={(e) => {
        if (e.key !== 'Enter' || !refused) return;
        e.preventDefault();
        setFocusSummary(true);
        setRefused([...refused]);
      }}
    >
      <div className="sm:col-span-2 lg:col-span-4 empty:hidden">
        <FormProblems error={null} problems={refused} labels={LABELS} fieldIds={ids} takeFocus={focusSummary} />
      </div>
      <SelectField label="Station" value={filters.stationId === null ? '' : String(filters.stationId)} onChange={(v) => apply(withFilter(filters, 'stationId', v ? Number(v) : null))}>
        <option value="">All my stations</option>
        {stations.map((s) => (
          <option key={s.id} value={s.id}>
            {s.iata} · {s.name}
          </option>
        ))}
      </SelectField>
      <DateField id={ids.from} invalid={refused?.some((p) => p.field === 'from')} label="Flights from" value={filters.from} onChange={(v) => apply(withFilter(filters, 'from', v))} />
      <DateField id={ids.to} invalid={refused?.some((p) => p.field === 'to')} label="Flights to" value={filters.to} onChange={(v) => apply(withFilter(filters, 'to', v))} />
      <SelectField label="Regime" value={filters.regime} onChange={(v) => apply(withFilter(filters, 'regime', v as LedgerFilters['regime']))}>
        <option value="">Any regime</option>
        {REGIMES.map((r) => (
          <option key={r} value={r}>
            {REGIME_LABELS[r]}
          </option>
        ))}
      </SelectField>
      <SelectField label="State" value={filters.state} onChange={(v) => apply(withFilter(filters, 'state', v as LedgerFilters['state']))}>
        <option value="">Any state</option>
        {COMPENSATION_STATES.map((s) => (
          <option key={s} value={s}>
            {STATE_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Medium" value={filters.medium} onChange={(v) => apply(withFilter(filters, 'medium', v as LedgerFilters['medium']))}>
        <option value="">Any medium</option>
        {MEDIA.map((m) => (
          <option key={m} value={m}>
            {MEDIUM_LABELS[m]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Deadline" value={filters.due} onChange={(v) => apply(withFilter(filters, 'due', v as LedgerFilters['due']))}>
        <option value="">Any</option>
        <option value="due-soon">Due soon (owed, deadline within 2 h)</option>
        <option value="overdue">Overdue (owed, past the rule’s deadline)</option>
      </SelectField>
    </form>
  );
}
