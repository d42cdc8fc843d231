import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { PlannerInput } from '@shared/schemas/planner';
import type { SavedPlan } from '@shared/schemas/plans';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { formatMoney } from '../../../lib/format';
import { plansQueryOptions, useSavePlan } from '../api/plans';

interface Props {
  stationId: number;
  timeZone: string;
  routeKey: string | null;
  /** The validated inputs, or null while a field is wrong. */
  input: PlannerInput | null;
  /** Reveals every field's error when a save is tried on an incomplete form. */
  onInvalidSave: () => void;
  /** Hands field problems the server found back to the form, keyed by the API's field path. */
  onServerProblems: (problems: { field: string; rule: string }[]) => void;
  onOpen: (plan: SavedPlan) => void;
}

function savedAt(iso: string, timeZone: string): string {
  return new Intl.DateTimeFormat('en-GB', { timeZone, dateStyle: 'medium', timeStyle: 'short' }).format(new Date(iso));
}

/** The newest few at first: the latest thinking on a route matters most. */
const SHOWN_AT_FIRST = 5;

function PlanList({ stationId, routeKey, timeZone, onOpen }: { stationId: number; routeKey: string; timeZone: string; onOpen: (plan: SavedPlan) => void }) {
  const { data, isPending, error } = useQuery(plansQueryOptions(stationId, routeKey));
  const [showAll, setShowAll] = useState(false);
  if (isPending) return <p className="text-ink-soft">Loading saved plans…</p>;
  if (error) return <p role="alert" className="font-bold text-alert">{error.message}</p>;
  if (!data.plans.length) return <p className="text-ink-soft">No plans saved for {routeKey} yet.</p>;
  const shown = showAll ? data.plans : data.plans.slice(0, SHOWN_AT_FIRST);
  return (
    <div className="space-y-2">
      <ul className="space-y-2" aria-label={`Saved plans for ${routeKey}`}>
        {shown.map((p) => (
          <li key={p.id} className="rounded-md border-2 border-line bg-paper p-3">
            <div className="flex flex-wrap items-start justify-between gap-2">
              <div>
                <p className="text-lg font-bold">{p.name}</p>
                <p>
                  Best: <strong>{p.result.bookings} bookings</strong>, expected net {formatMoney(p.result.expectedNetMinor, p.inputs.currency)}
                </p>
                <p className="text-sm text-ink-soft">
                  {p.inputs.capacity} seats · show rate {p.inputs.showProbability} · revenue {formatMoney(p.inputs.revenuePerBookingMinor, p.inputs.currency)} · cost {formatMoney(p.inputs.costPerDenialMinor, p.inputs.currency)}
                  {p.inputs.rho !== undefined && ` · rho ${p.inputs.rho}`}
                </p>
                <p className="text-sm text-ink-soft">
                  Saved by {p.createdBy.displayName}, {savedAt(p.createdAt, timeZone)}
                </p>
              </div>
              <Button type="button" variant="secondary" onClick={() => onOpen(p)} aria-label={`Open plan ${p.name}`}>
                Open
              </Button>
            </div>
          </li>
        ))}
      </ul>
      {data.plans.length > SHOWN_AT_FIRST && (
        <Button type="button" variant="quiet" onClick={() => setShowAll((v) => !v)}>
          {showAll ? `Show the newest ${SHOWN_AT_FIRST} only` : `Show all ${data.plans.length} plans`}
        </Button>
      )}
    </div>
  );
}

/** Saving is checked with the shared schema first, then by the server, whose field problems come back to the form. */
export function SavedPlans({ stationId, timeZone, routeKey, input, onInvalidSave, onServerProblems, onOpen }: Props) {
  const [name, setName] = useState('');
  const [nameError, setNameError] = useState<string>();
  const [formError, setFormError] = useState<string>();
  const [savedName, setSavedName] = useState<string>();
  const save = useSavePlan();

  async function submit(e: FormEvent) {
    e.preventDefault();
    setSavedName(undefined);
    setFormError(undefined);
    const trimmed = name.trim();
    setNameError(trimmed ? undefined : 'Plan name is required');
    if (!routeKey || !input) onInvalidSave();
    if (!routeKey || !input || !trimmed) return;
    try {
      const plan = await save.mutateAsync({ stationId, routeKey, name: trimmed, inputs: input });
      setSavedName(plan.name);
      setName('');
    } catch (err) {
      const problems = err instanceof ApiRequestError ? (err.body.details ?? []) : [];
      setNameError(problems.find((p) => p.field === 'name')?.rule);
      onServerProblems(problems);
      if (!problems.length) setFormError(err instanceof Error ? err.message : 'The plan was not saved; try again.');
    }
  }

  return (
    <div className="space-y-4">
      <form onSubmit={submit} noValidate className="space-y-2" aria-label="Save this plan">
        <div className="flex flex-wrap items-start gap-3">
          <TextField className="min-w-64 flex-1" label="Plan name" value={name} onChange={setName} error={nameError} maxLength={100} placeholder="e.g. Summer weekdays, cost 2 x fare" />
          <Button type="submit" className="mt-8" disabled={save.isPending}>
            {save.isPending ? 'Saving…' : routeKey ? `Save plan for ${routeKey}` : 'Save plan'}
          </Button>
        </div>
        {formError && <p role="alert" className="font-bold text-alert">{formError}</p>}
        <p role="status" className="font-bold text-calm">{savedName ? `Saved “${savedName}”.` : ''}</p>
      </form>
      {routeKey ? <PlanList key={routeKey} stationId={stationId} routeKey={routeKey} timeZone={timeZone} onOpen={onOpen} /> : <p className="text-ink-soft">Choose where the plan is for to see the plans saved for it.</p>}
    </div>
  );
}
