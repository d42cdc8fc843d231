import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { VolunteerPolicy } from '@shared/schemas/volunteers';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { formatMoney } from '../../../lib/format';
import { policyQueryOptions, useSavePolicy } from '../api/rounds';
import { checkPolicyDraft, draftField, draftFromPolicy, type PolicyDraft, type PolicyErrors } from '../model/policy-draft';
import { PolicyListField } from './policy-list-field';

/** The station's volunteer policy: the offer ladder, the agent's limit, sealed-bid pricing, extras and voucher terms. */
export function VolunteerPolicyEditor({ stationId }: { stationId: number }) {
  const policy = useQuery(policyQueryOptions(stationId));
  if (policy.isPending) return <p className="text-ink-soft">Loading the volunteer policy…</p>;
  if (policy.error) return <p role="alert" className="font-bold text-alert">The volunteer policy could not be loaded: {policy.error.message}</p>;
  return <PolicyForm key={stationId} stationId={stationId} loaded={policy.data} />;
}

function PolicyForm({ stationId, loaded }: { stationId: number; loaded: VolunteerPolicy }) {
  const [draft, setDraft] = useState<PolicyDraft>(() => draftFromPolicy(loaded));
  const [tried, setTried] = useState(false);
  const [serverErrors, setServerErrors] = useState<PolicyErrors>({});
  const [saved, setSaved] = useState(false);
  const save = useSavePolicy(stationId);
  const live = tried ? checkPolicyDraft(draft) : null;
  const errors: PolicyErrors = { ...(live && !live.ok ? live.errors : {}), ...serverErrors };
  const problems = Object.keys(errors).length;

  function change(next: Partial<PolicyDraft>) {
    setDraft({ ...draft, ...next });
    setServerErrors({});
    setSaved(false);
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    setTried(true);
    const checked = checkPolicyDraft(draft);
    if (!checked.ok) return;
    try {
      const result = await save.mutateAsync(checked.policy);
      setDraft(draftFromPolicy(result));
      setSaved(true);
      setTried(false);
    } catch (err) {
      const details = err instanceof ApiRequestError ? (err.body.details ?? [{ field: 'form', rule: err.message }]) : [{ field: 'form', rule: String(err) }];
      setServerErrors(Object.fromEntries(details.map((d) => [draftField(d.field), d.rule])));
    }
  }

  const ladder = draft.ladder;
  return (
    <form onSubmit={submit} noValidate aria-label="Volunteer policy" className="space-y-5">
      <p className="text-ink-soft">What agents may offer volunteers at this station. Changes apply to rounds opened or raised after saving.</p>
      <div className="grid gap-5 lg:grid-cols-2">
        <fieldset className="space-y-2">
          <legend className="font-bold">Offer ladder ({draft.currency || 'currency'}): the amounts an agent raises through, lowest first</legend>
          {ladder.map((step, i) => (
            <div key={i} className="flex items-start gap-2">
              <TextField
                label={`Step ${i + 1}`} className="flex-1" inputMode="decimal" autoComplete="off" value={step} error={errors[`ladder.${i}`]}
                onChange={(v) => change({ ladder: ladder.map((s, j) => (j === i ? v : s)) })}
              />
              <Button type="button" variant="quiet" className="mt-7" disabled={ladder.length === 1} onClick={() => change({ ladder: ladder.filter((_, j) => j !== i) })} aria-label={`Remove step ${i + 1}`}>
                Remove
              </Button>
            </div>
          ))}
          {errors.ladder && <p className="font-bold text-alert">{errors.ladder}</p>}
          <Button type="button" variant="secondary" disabled={ladder.length >= 12} onClick={() => change({ ladder: [...ladder, ''] })}>
            Add a step
          </Button>
        </fieldset>
        <div className="space-y-4">
          <TextField label="Currency" value={draft.currency} onChange={(v) => change({ currency: v.toUpperCase() })} maxLength={3} error={errors.currency} hint="ISO 4217 code, e.g. USD, EUR, CAD." />
          <TextField
            label={`Agent limit (${draft.currency})`} inputMode="decimal" autoComplete="off" value={draft.agentLimit} error={errors.agentLimit}
            onChange={(v) => change({ agentLimit: v })} hint="Agents and admins set amounts up to this alone; a higher amount waits for a supervisor."
          />
          <TextField
            label={`Supervisor limit (${draft.currency})`} inputMode="decimal" autoComplete="off" value={draft.supervisorLimit} error={errors.supervisorLimit}
            onChange={(v) => change({ supervisorLimit: v })} hint="Leave blank for no limit; above it, another supervisor approves."
          />
          <fieldset>
            <legend className="mb-1 font-bold">When the offer is raised</legend>
            {(
              [
                ['lift-to-new-offer', 'Volunteers accepted earlier get the new amount'],
                ['keep-agreed', 'Volunteers accepted earlier keep what they agreed'],
              ] as const
            ).map(([value, label]) => (
              <label key={value} className="flex items-center gap-2 text-lg">
                <input type="radio" name={`raise-${stationId}`} className="h-5 w-5" checked={draft.raisePolicy === value} onChange={() => change({ raisePolicy: value })} />
                {label}
              </label>
            ))}
          </fieldset>
          <fieldset>
            <legend className="mb-1 font-bold">Sealed-bid pricing</legend>
            {(
              [
                ['own-ask', 'Pay each volunteer their own ask'],
                ['common-price', 'Pay every accepted volunteer the highest accepted ask'],
              ] as const
            ).map(([value, label]) => (
              <label key={value} className="flex items-center gap-2 text-lg">
                <input type="radio" name={`pricing-${stationId}`} className="h-5 w-5" checked={draft.sealedBidPricing === value} onChange={() => change({ sealedBidPricing: value })} />
                {label}
              </label>
            ))}
            {errors.sealedBidPricing && <p className="font-bold text-alert">{errors.sealedBidPricing}</p>}
          </fieldset>
        </div>
      </div>
      <div className="grid gap-5 lg:grid-cols-2">
        <PolicyListField label="Extras an agent may add" hint="One per line, at most 6, e.g. Meal voucher." value={draft.extras} onChange={(v) => change({ extras: v })} error={errors.extras} rows={4} />
        <PolicyListField label="Voucher restrictions read to volunteers" hint="One per line, at most 10." value={draft.voucherRestrictions} onChange={(v) => change({ voucherRestrictions: v })} error={errors.voucherRestrictions} rows={5} />
      </div>
      {errors.form && <p role="alert" className="font-bold text-alert">{errors.form}</p>}
      {problems > 0 && !errors.form && (
        <p role="alert" className="font-bold text-alert">
          {problems === 1 ? 'One value needs fixing' : `${problems} values need fixing`} before the policy can be saved. Nothing was saved.
        </p>
      )}
      {saved && save.data && (
        <p role="status" className="rounded-md border-l-4 border-calm bg-calm-soft px-3 py-2 font-bold">
          Saved. Agents now offer {save.data.ladderMinor.map((m) => formatMoney(m, save.data.currency)).join(', ')}, up to {formatMoney(save.data.agentLimitMinor, save.data.currency)} alone.
        </p>
      )}
      <Button type="submit" disabled={save.isPending}>{save.isPending ? 'Saving…' : 'Save the volunteer policy'}</Button>
    </form>
  );
}
