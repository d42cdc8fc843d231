import { useQuery } from '@tanstack/react-query';
import { Temporal } from '@js-temporal/polyfill';
import { useId, useState, type FormEvent } from 'react';
import {
  recordDenialAfterBodySchema, recordRefusalBodySchema, REFUSAL_GROUNDS, type DenialCandidates,
} from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { formatTime, zoneLabel } from '../../../lib/format';
import { refusalsQueryOptions, useRecordDenialAfter, useRecordRefusal } from '../api/denials';

interface Person {
  passengerId: number;
  label: string;
}

/** Everyone still on the flight, ranked or set aside, as choices for a form. */
export function peopleOf(c: DenialCandidates): Person[] {
  const ranked = c.candidates.flatMap((u) => u.passengerIds.map((id, i) => ({ passengerId: id, label: `${u.names[i]} (${u.pnr})` })));
  const aside = c.excluded.map((e) => ({ passengerId: e.passengerId, label: `${e.name} (${e.pnr})` }));
  return [...ranked, ...aside].sort((a, b) => a.label.localeCompare(b.label));
}

const GROUND_WORDS: Record<(typeof REFUSAL_GROUNDS)[number], string> = {
  safety: 'Safety',
  security: 'Security',
  health: 'Health',
  conduct: 'The passenger’s conduct',
};

function PersonSelect({ people, value, onChange, error }: { people: Person[]; value: string; onChange: (v: string) => void; error?: string }) {
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="mb-1 block font-bold">Passenger</label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={error ? true : undefined} className="w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg">
        <option value="">Choose a passenger…</option>
        {people.map((p) => (
          <option key={p.passengerId} value={String(p.passengerId)}>{p.label}</option>
        ))}
      </select>
      {error && <p role="alert" className="mt-1 font-bold text-alert">{error}</p>}
    </div>
  );
}

const fieldErrors = (err: unknown, fallback: string): Record<string, string> => {
  const details = err instanceof ApiRequestError ? err.body.details : undefined;
  return details?.length ? Object.fromEntries(details.map((d) => [d.field, err instanceof Error ? err.message : d.rule])) : { form: err instanceof Error ? err.message : fallback };
};

/** Refusing carriage for safety, security, health or conduct: recorded with its reason, never a denial, nothing owed. */
export function RefusalForm({ flightId, people }: { flightId: number; people: Person[] }) {
  const [passenger, setPassenger] = useState('');
  const [ground, setGround] = useState('');
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const record = useRecordRefusal(flightId);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setDone(null);
    const body = recordRefusalBodySchema.safeParse({ passengerIds: passenger ? [Number(passenger)] : [], ground: ground || undefined, reason });
    if (!body.success) {
      setErrors(Object.fromEntries(body.error.issues.map((i) => [String(i.path[0] ?? 'form'), i.message])));
      return;
    }
    setErrors({});
    try {
      const saved = await record.mutateAsync(body.data);
      setDone(`Refusal recorded for ${saved.names.join(', ')}: not a denial of boarding, no compensation.`);
      setPassenger('');
      setGround('');
      setReason('');
    } catch (err) {
      setErrors(fieldErrors(err, 'Not recorded.'));
    }
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label="Refuse carriage">
      <p className="text-sm">
        For safety, security, health or the passenger’s conduct. This is not a denial of boarding: no compensation is owed and it is not on the denied-boarding report.
      </p>
      <PersonSelect people={people} value={passenger} onChange={setPassenger} error={errors.passengerIds} />
      <fieldset>
        <legend className="font-bold">Ground</legend>
        <div className="flex flex-wrap gap-4">
          {REFUSAL_GROUNDS.map((g) => (
            <label key={g} className="flex items-center gap-2 py-1">
              <input type="radio" name="ground" className="h-5 w-5" checked={ground === g} onChange={() => setGround(g)} />
              {GROUND_WORDS[g]}
            </label>
          ))}
        </div>
        {errors.ground && <p role="alert" className="font-bold text-alert">{errors.ground}</p>}
      </fieldset>
      <TextField label="Reason (required)" value={reason} onChange={setReason} error={errors.reason} hint="What happened, in a sentence; it is kept with the record." />
      {errors.form && <p role="alert" className="font-bold text-alert">{errors.form}</p>}
      {done && <p role="status" className="font-bold text-calm"><span aria-hidden>✓ </span>{done}</p>}
      <Button type="submit" variant="danger" disabled={record.isPending}>{record.isPending ? 'Recording…' : 'Record the refusal'}</Button>
    </form>
  );
}

export function RefusalList({ flightId, timeZone }: { flightId: number; timeZone: string }) {
  const { data } = useQuery(refusalsQueryOptions(flightId));
  const list = data?.refusals ?? [];
  if (list.length === 0) return <p className="text-ink-soft">No refusals of carriage on this flight.</p>;
  return (
    <ul className="space-y-2" aria-label="Refusals of carriage">
      {list.map((r) => (
        <li key={r.id}>
          <span className="font-bold">{r.names.join(', ')}</span> <span className="text-ink-soft">({r.pnr})</span> · {GROUND_WORDS[r.ground]} · by {r.refusedBy} at {formatTime(r.refusedAt, timeZone)}
          <p className="text-sm">“{r.reason}” — not a denial of boarding, nothing owed.</p>
        </li>
      ))}
    </ul>
  );
}

/**
 * A supervisor's correction: a denial that happened but was not recorded. The time is typed as the station's wall
 * clock and read in the station's zone; its date picks the amounts in force that day.
 */
export function RecordedDenialForm({ flightId, people, timeZone }: { flightId: number; people: Person[]; timeZone: string }) {
  const [passenger, setPassenger] = useState('');
  const [when, setWhen] = useState('');
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const record = useRecordDenialAfter(flightId);

  function occurredAt(): string | undefined {
    try {
      return Temporal.PlainDateTime.from(when).toZonedDateTime(timeZone).toString({ timeZoneName: 'never', smallestUnit: 'second' });
    } catch {
      return undefined;
    }
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    setDone(null);
    const body = recordDenialAfterBodySchema.safeParse({ passengerIds: passenger ? [Number(passenger)] : [], occurredAt: occurredAt(), reason });
    if (!body.success) {
      setErrors(Object.fromEntries(body.error.issues.map((i) => [String(i.path[0] ?? 'form'), i.path[0] === 'occurredAt' ? 'occurredAt: give the date and time it happened' : i.message])));
      return;
    }
    setErrors({});
    try {
      await record.mutateAsync(body.data);
      setDone('Denial recorded and authorized; rebook the passenger below to fix what is owed and send the statement.');
      setPassenger('');
      setWhen('');
      setReason('');
    } catch (err) {
      setErrors(fieldErrors(err, 'Not recorded.'));
    }
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label="Record a denial after the fact">
      <p className="text-sm">A correction for a passenger who was denied boarding but not recorded at the time. It is audited with your name and reason.</p>
      <PersonSelect people={people} value={passenger} onChange={setPassenger} error={errors.passengerIds} />
      <TextField label={`When it happened (${zoneLabel(timeZone)})`} type="datetime-local" value={when} onChange={setWhen} error={errors.occurredAt} hint="Station time; its date chooses the compensation amounts in force that day." />
      <TextField label="Reason for the correction (required)" value={reason} onChange={setReason} error={errors.reason} />
      {errors.form && <p role="alert" className="font-bold text-alert">{errors.form}</p>}
      {done && <p role="status" className="font-bold text-calm"><span aria-hidden>✓ </span>{done}</p>}
      <Button type="submit" variant="danger" disabled={record.isPending}>{record.isPending ? 'Recording…' : 'Record the denial'}</Button>
    </form>
  );
}
