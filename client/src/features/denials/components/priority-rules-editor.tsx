import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { describeRules, type PriorityRuleInput } from '@shared/denial';
import { priorityRulesBodySchema, type StationPriorityRules } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { priorityRulesQueryOptions, useSavePriorityRules } from '../api/denials';
import { DIRECTIONS, FACTOR_LABELS, FACTORS, type Factor } from '../model/rule-choices';

/** The station admin's boarding-priority rules for involuntary denial, in order, with the statement's wording as a preview. */
export function PriorityRulesEditor({ stationId }: { stationId: number }) {
  const saved = useQuery(priorityRulesQueryOptions(stationId));
  if (saved.error) return <p role="alert" className="font-bold text-alert">{saved.error.message}</p>;
  if (!saved.data) return <p className="text-ink-soft">Loading the rules…</p>;
  return <RulesForm key={stationId} stationId={stationId} saved={saved.data} />;
}

function RulesForm({ stationId, saved }: { stationId: number; saved: StationPriorityRules }) {
  const [rules, setRules] = useState<PriorityRuleInput[]>(saved.rules);
  const [tiers, setTiers] = useState(saved.tierOrder.join(', '));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState(false);
  const save = useSavePriorityRules(stationId);
  const unused = FACTORS.filter((f) => !rules.some((r) => r.factor === f));
  const preview = (() => {
    try {
      return describeRules(rules);
    } catch (err) {
      return [err instanceof Error ? err.message : 'These rules cannot be described.'];
    }
  })();

  const move = (from: number, to: number) => {
    const next = [...rules];
    const [rule] = next.splice(from, 1);
    next.splice(to, 0, rule);
    setRules(next);
  };
  const ruleFor = (factor: Factor, direction?: string) => ({ factor, direction: direction ?? DIRECTIONS[factor][0].value }) as PriorityRuleInput;

  async function submit(e: FormEvent) {
    e.preventDefault();
    setDone(false);
    const tierOrder = tiers.split(',').map((t) => t.trim()).filter((t) => t !== '');
    const body = priorityRulesBodySchema.safeParse({ rules, tierOrder });
    if (!body.success) {
      setErrors(Object.fromEntries(body.error.issues.map((i) => [String(i.path[0] ?? 'form'), i.message])));
      return;
    }
    setErrors({});
    try {
      await save.mutateAsync({ rules, tierOrder });
      setDone(true);
    } catch (err) {
      const details = err instanceof ApiRequestError ? err.body.details : undefined;
      setErrors(details?.length ? Object.fromEntries(details.map((d) => [d.field.split('.')[0], d.rule])) : { form: err instanceof Error ? err.message : 'Not saved.' });
    }
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4 lg:grid-cols-[3fr_2fr]" aria-label="Boarding priority rules">
      <div className="space-y-3">
        <p>{saved.isDefault ? 'This station uses the built-in default.' : 'This station’s own rules.'} Passengers are selected by the first rule; the next rule breaks ties.</p>
        <ol className="space-y-2">
          {rules.map((rule, index) => (
            <li key={rule.factor} className="flex flex-wrap items-center gap-2 rounded-md border-2 border-line p-2">
              <span className="w-6 font-bold">{index + 1}.</span>
              <span className="w-44 font-bold">{FACTOR_LABELS[rule.factor]}</span>
              <label className="flex items-center gap-1">
                <span className="sr-only">Direction for {FACTOR_LABELS[rule.factor]}</span>
                <select
                  className="rounded-md border-2 border-line bg-card px-2 py-1"
                  value={rule.direction ?? DIRECTIONS[rule.factor][0].value}
                  onChange={(e) => setRules(rules.map((r, i) => (i === index ? ruleFor(rule.factor, e.target.value) : r)))}
                >
                  {DIRECTIONS[rule.factor].map((d) => (
                    <option key={d.value} value={d.value}>{d.label}</option>
                  ))}
                </select>
              </label>
              <span className="ml-auto flex gap-1">
              <Button type="button" variant="quiet" className="px-2" disabled={index === 0} onClick={() => move(index, index - 1)} aria-label={`Move ${FACTOR_LABELS[rule.factor]} up`}>↑</Button>
              <Button type="button" variant="quiet" className="px-2" disabled={index === rules.length - 1} onClick={() => move(index, index + 1)} aria-label={`Move ${FACTOR_LABELS[rule.factor]} down`}>↓</Button>
              <Button type="button" variant="quiet" className="px-2" disabled={rules.length === 1} onClick={() => setRules(rules.filter((_, i) => i !== index))} aria-label={`Remove ${FACTOR_LABELS[rule.factor]}`}>Remove</Button>
              </span>
            </li>
          ))}
        </ol>
        {errors.rules && <p role="alert" className="font-bold text-alert">{errors.rules}</p>}
        {unused.length > 0 && (
          <label className="flex items-center gap-2">
            <span className="font-bold">Add a rule</span>
            <select className="rounded-md border-2 border-line bg-card px-2 py-1" value="" onChange={(e) => e.target.value && setRules([...rules, ruleFor(e.target.value as Factor)])}>
              <option value="">Choose…</option>
              {unused.map((f) => (
                <option key={f} value={f}>{FACTOR_LABELS[f]}</option>
              ))}
            </select>
          </label>
        )}
        <TextField label="Frequent-flyer tiers, lowest first" value={tiers} onChange={setTiers} error={errors.tierOrder} hint="Separated by commas, e.g. silver, gold, platinum." />
        {errors.form && <p role="alert" className="font-bold text-alert">{errors.form}</p>}
        {done && <p role="status" className="font-bold text-calm"><span aria-hidden>✓ </span>Saved. Rankings at this station follow the new rules.</p>}
        <Button type="submit" disabled={save.isPending}>{save.isPending ? 'Saving…' : 'Save the rules'}</Button>
      </div>
      <div>
        <p className="mb-1 font-bold">How the written statement will put it</p>
        <ul className="list-disc space-y-1 pl-5 text-sm">
          {preview.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </div>
    </form>
  );
}
