import { useCallback, useDeferredValue, useMemo, useState } from 'react';
import type { Station } from '@shared/schemas/stations';
import type { SavedPlan } from '@shared/schemas/plans';
import { parseRouteKey } from '@shared/schemas/plans';
import { Caution, Page, Panel } from '../../../components/ui/page';
import { computePlan } from '../model/curve';
import { EMPTY_FIELDS, checkPlannerFields, fieldForServerPath, fieldsFromInput, type PlannerFieldName, type PlannerFields } from '../model/planner-fields';
import { EMPTY_TARGET, checkTarget, type TargetFieldName, type TargetFields } from '../model/plan-target';
import { DenialCostHelper } from './denial-cost-helper';
import { PlanResult } from './plan-result';
import { PlanTargetFields } from './plan-target-fields';
import { PlannerInputs } from './planner-inputs';
import { SavedPlans } from './saved-plans';
import { LearnedRatesNote } from './learned-rates-note';

type Touched = Partial<Record<PlannerFieldName | TargetFieldName, boolean>>;

/** Computes from the last figures that passed the schema, so a mistyped field leaves the previous answer in view. */
function useComputedPlan(validFields: PlannerFields | null, currency: string) {
  // Typing stays instant; the curve follows as soon as the browser has a moment (large cabins take tens of ms).
  const deferred = useDeferredValue(validFields);
  return useMemo(() => {
    const check = deferred && checkPlannerFields(deferred, currency);
    if (!check?.ok) return null;
    try {
      return { input: check.input, result: computePlan(check.input) };
    } catch (err) {
      return { input: check.input, error: err instanceof Error ? err.message : String(err) };
    }
  }, [deferred, currency]);
}

export function PlannerScreen({ station }: { station: Station }) {
  const [target, setTarget] = useState<TargetFields>(EMPTY_TARGET);
  const [fields, setFields] = useState<PlannerFields>(EMPTY_FIELDS);
  const [validFields, setValidFields] = useState<PlannerFields | null>(null);
  const [touched, setTouched] = useState<Touched>({});
  const [showAll, setShowAll] = useState(false);
  const [serverErrors, setServerErrors] = useState<Partial<Record<PlannerFieldName | 'destination', string>>>({});

  const check = checkPlannerFields(fields, station.currency);
  const targetCheck = checkTarget(station.iata, target);
  const computed = useComputedPlan(validFields, station.currency);
  const stale = !check.ok && computed !== null;
  const visible = (name: PlannerFieldName | TargetFieldName) => showAll || touched[name];

  const fieldErrors: Partial<Record<PlannerFieldName, string>> = {};
  for (const name of Object.keys(EMPTY_FIELDS) as PlannerFieldName[]) {
    const message = (!check.ok && visible(name) ? check.errors[name] : undefined) ?? serverErrors[name];
    if (message) fieldErrors[name] = message;
  }
  const targetErrors: Partial<Record<TargetFieldName, string>> = {};
  if (!targetCheck.ok) for (const [name, message] of Object.entries(targetCheck.errors)) if (visible(name as TargetFieldName)) targetErrors[name as TargetFieldName] = message;
  targetErrors.destination ??= serverErrors.destination;

  function updateFields(next: PlannerFields) {
    setFields(next);
    if (checkPlannerFields(next, station.currency).ok) setValidFields(next);
  }
  function changeField(name: PlannerFieldName, text: string) {
    updateFields({ ...fields, [name]: text });
    setServerErrors((old) => ({ ...old, [name]: undefined }));
  }
  function changeTarget(next: TargetFields) {
    // a part counts as touched once it holds text, so its error shows while it is being typed
    setTouched((old) => ({ ...old, destination: old.destination || next.destination !== '', designator: old.designator || next.designator !== '', date: old.date || next.date !== '' }));
    setServerErrors((old) => ({ ...old, destination: undefined }));
    setTarget(next);
  }
  function openPlan(plan: SavedPlan) {
    updateFields(fieldsFromInput(plan.inputs));
    const parts = parseRouteKey(plan.routeKey);
    if (parts) setTarget({ kind: parts.flight ? 'flight' : 'route', destination: parts.destination, designator: parts.flight?.designator ?? '', date: parts.flight?.date ?? '' });
  }
  function takeServerProblems(problems: { field: string; rule: string }[]) {
    const next: typeof serverErrors = {};
    for (const p of problems) {
      const field = p.field === 'routeKey' ? 'destination' : fieldForServerPath(p.field);
      if (field) next[field] ??= p.rule;
    }
    setServerErrors(next);
  }

  const destinationOk = /^[A-Z]{3}$/.test(target.destination.trim().toUpperCase()) ? target.destination.trim().toUpperCase() : null;
  const useLearned = useCallback((showRate: string, rho: string) => {
    setFields((old) => {
      const next = { ...old, showRate, rho };
      if (checkPlannerFields(next, station.currency).ok) setValidFields(next);
      return next;
    });
  }, [station.currency]);
  const capacity = check.ok ? check.input.capacity : undefined;
  const revenue = check.ok ? check.input.revenuePerBookingMinor : undefined;
  return (
    <Page title={`Planner · ${station.iata}`} subtitle={`How many bookings to accept on a route or a future flight from ${station.name}.`}>
      <Caution>
        These figures are a model. They assume every booking shows up with the rate you typed, independently unless you give a correlation. Real show-ups move with the day, the fare mix and connections: check the limit against your station’s history before you change it.
      </Caution>
      <div className="mt-4 grid items-start gap-4 lg:grid-cols-[minmax(22rem,27rem)_1fr]">
        <div className="space-y-4">
          <Panel title="What you plan">
            <PlanTargetFields origin={station.iata} value={target} onChange={changeTarget} errors={targetErrors} />
          </Panel>
          <Panel title="Figures">
            <div className="mb-3">
              <LearnedRatesNote stationId={station.id} origin={station.iata} destination={destinationOk} showRateEmpty={fields.showRate.trim() === ''} onUse={useLearned} />
            </div>
            <PlannerInputs
              currency={station.currency}
              value={fields}
              onChange={changeField}
              onBlur={(name) => setTouched((old) => ({ ...old, [name]: true }))}
              errors={fieldErrors}
              costHelper={
                <DenialCostHelper
                  regime={station.regime}
                  currency={station.currency}
                  timeZone={station.timeZone}
                  revenuePerBookingMinor={revenue}
                  aircraftSeats={capacity}
                  onUse={(text) => {
                    changeField('costPerDenial', text);
                    setTouched((old) => ({ ...old, costPerDenial: true }));
                  }}
                />
              }
            />
            {!check.ok && check.errors.form && visible('capacity') && <p className="mt-2 font-bold text-alert">{check.errors.form}</p>}
          </Panel>
        </div>
        <div className="min-w-0 space-y-4">
          <Panel className="min-w-0">
            <section aria-labelledby="planner-result-heading">
              <h2 id="planner-result-heading" className="sr-only">Result</h2>
              {stale && (
                <p role="status" className="mb-3 rounded-md border-l-4 border-alert bg-alert-soft px-3 py-2 font-bold">
                  These are the figures of your last valid entry. Correct the field marked in red to update them.
                </p>
              )}
              {computed?.result ? (
                <PlanResult input={computed.input} result={computed.result} />
              ) : computed?.error ? (
                <p role="alert" className="font-bold text-alert">The curve could not be computed: {computed.error}</p>
              ) : (
                <div className="space-y-2 py-8 text-center">
                  <p className="text-2xl font-bold text-harbour">Type the seats, show rate, revenue and cost</p>
                  <p className="text-lg text-ink-soft">The best number of bookings, the curve and its table appear here as soon as every figure is valid.</p>
                </div>
              )}
            </section>
          </Panel>
          <Panel title="Saved plans">
            <SavedPlans
              stationId={station.id}
              timeZone={station.timeZone}
              routeKey={targetCheck.ok ? targetCheck.routeKey : null}
              input={check.ok ? check.input : null}
              onInvalidSave={() => setShowAll(true)}
              onServerProblems={takeServerProblems}
              onOpen={openPlan}
            />
          </Panel>
        </div>
      </div>
    </Page>
  );
}
