import { useState, type FormEvent } from 'react';
import { setShockBodySchema, type Forecast } from '@shared/schemas/flight-desk';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/page';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { useSetShock } from '../api/flight-desk';
import { describeShock, shockChoiceOf, shockFor, WEATHER_DAY_RHO, type ShockChoice } from '../model/shock';

const CHOICES: { value: ShockChoice; label: string; hint: string }[] = [
  { value: 'none', label: 'None', hint: 'Passengers show up independently.' },
  { value: 'weather', label: `Weather day (correlation ${WEATHER_DAY_RHO})`, hint: 'Everyone is a little more likely to be late or early together.' },
  { value: 'custom', label: 'Custom correlation', hint: 'Above 0 and below 1; larger means everyone moves together more.' },
];

/** For supervisors: tell the model that something today moves everybody's show-up at once. */
export function ShockControl({ flightId, current }: { flightId: number; current: Forecast['shock'] }) {
  const [choice, setChoice] = useState<ShockChoice>(shockChoiceOf(current));
  const [rho, setRho] = useState(current?.kind === 'beta-binomial' ? String(current.rho) : '0.05');
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState(false);
  const setShock = useSetShock(flightId);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setSaved(false);
    const shock = shockFor(choice, rho);
    if (shock?.kind === 'beta-binomial' && !Number.isFinite(shock.rho)) {
      setErrors({ rho: 'The correlation must be a number, for example 0.05' });
      return;
    }
    const body = setShockBodySchema.safeParse({ shock, reason });
    if (!body.success) {
      setErrors(Object.fromEntries(body.error.issues.map((i) => [i.path.includes('rho') ? 'rho' : String(i.path[0] ?? 'form'), i.message])));
      return;
    }
    setErrors({});
    try {
      await setShock.mutateAsync(body.data);
      setReason('');
      setSaved(true);
    } catch (err) {
      const message = err instanceof Error ? err.message : 'The change was not saved.';
      const details = err instanceof ApiRequestError ? err.body.details : undefined;
      setErrors(details?.length ? Object.fromEntries(details.map((d) => [d.field.includes('rho') ? 'rho' : d.field, d.rule])) : { form: message });
    }
  }

  return (
    <Panel title="Common shock">
      <p className="mb-3">Now: {describeShock(current)}.</p>
      <form onSubmit={submit} noValidate className="space-y-3" aria-label="Set the common shock">
        <fieldset>
          <legend className="mb-1 font-bold">Today’s setting</legend>
          {CHOICES.map((c) => (
            <label key={c.value} className="flex items-start gap-2 py-1">
              <input type="radio" name="shock" className="mt-1 h-5 w-5" value={c.value} checked={choice === c.value} onChange={() => setChoice(c.value)} />
              <span>
                <span className="font-bold">{c.label}</span>
                <span className="block text-sm text-ink-soft">{c.hint}</span>
              </span>
            </label>
          ))}
        </fieldset>
        {choice === 'custom' && <TextField label="Correlation (0 to 1)" inputMode="decimal" value={rho} onChange={setRho} error={errors.rho} />}
        <TextField label="Reason" value={reason} onChange={setReason} error={errors.reason} hint="Recorded with the change, e.g. “snow, roads slow”." />
        {errors.form && (
          <p role="alert" className="font-bold text-alert">
            {errors.form}
          </p>
        )}
        {saved && (
          <p role="status" className="font-bold text-calm">
            <span aria-hidden>✓ </span>Saved; the odds above are recomputed.
          </p>
        )}
        <Button type="submit" disabled={setShock.isPending}>
          {setShock.isPending ? 'Saving…' : 'Apply to the odds'}
        </Button>
      </form>
    </Panel>
  );
}
