import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { ROLES, ROLE_LABELS, type Role } from '@shared/schemas/common';
import { createUserBodySchema, updateUserBodySchema, type User } from '@shared/schemas/users';
import { sessionQueryOptions } from '../../../lib/session';
import { ApiRequestError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { useFocusOnOpen } from '../../../components/ui/use-focus-on-open';
import { TextField } from '../../../components/ui/text-field';
import { useCreateUser, useUpdateUser } from '../api/users';

/** Creates a user, or edits one; validation uses the same schema the server applies, and nothing typed is lost on error. */
export function UserForm({ user, carrierWideViewer, onDone }: { user: User | null; carrierWideViewer: boolean; onDone: () => void }) {
  const { data: session } = useQuery(sessionQueryOptions());
  // The stations one may grant: one's own, and for a carrier-wide admin also those the user already holds.
  const myStations = [...(session?.user?.stations ?? []), ...(user?.stations ?? [])].filter((s, i, all) => all.findIndex((x) => x.id === s.id) === i);
  const [carrierWide, setCarrierWide] = useState(user?.carrierWide ?? false);
  const [email, setEmail] = useState(user?.email ?? '');
  const [displayName, setDisplayName] = useState(user?.displayName ?? '');
  const [role, setRole] = useState<Role>(user?.role ?? 'agent');
  const [stationIds, setStationIds] = useState<number[]>(user?.stations.map((s) => s.id) ?? []);
  const [password, setPassword] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const create = useCreateUser();
  const update = useUpdateUser();
  const pending = create.isPending || update.isPending;

  async function submit(e: FormEvent) {
    e.preventDefault();
    const body = user
      ? updateUserBodySchema.safeParse({ displayName, role, stationIds, ...(password ? { password } : {}), ...(carrierWideViewer ? { carrierWide: role === 'admin' && carrierWide } : {}) })
      : createUserBodySchema.safeParse({ email, displayName, role, stationIds, password, ...(carrierWideViewer ? { carrierWide: role === 'admin' && carrierWide } : {}) });
    if (!body.success) {
      setErrors(Object.fromEntries(body.error.issues.map((i) => [String(i.path[0] ?? 'form'), i.message])));
      return;
    }
    setErrors({});
    try {
      if (user) await update.mutateAsync({ id: user.id, body: body.data });
      else await create.mutateAsync(body.data as never);
      onDone();
    } catch (err) {
      if (err instanceof ApiRequestError) setErrors(Object.fromEntries((err.body.details ?? [{ field: 'form', rule: err.message }]).map((d) => [d.field, d.rule])));
    }
  }

  const heading = useFocusOnOpen();
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-lg border-2 border-harbour bg-harbour-soft/40 p-4" aria-label={user ? `Edit ${user.displayName}` : 'New user'}>
      <h3 ref={heading} tabIndex={-1} className="text-lg font-bold">{user ? `Edit ${user.displayName}` : 'New user'}</h3>
      <div className="grid gap-3 md:grid-cols-2">
        {!user && <TextField label="E-mail" type="email" value={email} onChange={setEmail} error={errors.email} />}
        <TextField label="Name" value={displayName} onChange={setDisplayName} error={errors.displayName} />
        <div>
          <label htmlFor="user-role" className="mb-1 block font-bold">
            Role
          </label>
          <select id="user-role" className="w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg" value={role} onChange={(e) => setRole(e.target.value as Role)}>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </div>
        <TextField label={user ? 'New password (leave empty to keep)' : 'Password'} type="password" autoComplete="new-password" value={password} onChange={setPassword} error={errors.password} hint="At least 12 characters." />
      </div>
      <fieldset>
        <legend className="font-bold">Stations</legend>
        <div className="mt-1 flex flex-wrap gap-4">
          {myStations.map((s) => (
            <label key={s.id} className="flex items-center gap-2">
              <input type="checkbox" className="h-5 w-5" checked={stationIds.includes(s.id)} onChange={(e) => setStationIds((ids) => (e.target.checked ? [...ids, s.id] : ids.filter((x) => x !== s.id)))} />
              {s.iata}
            </label>
          ))}
        </div>
        {errors.stationIds && <p className="mt-1 font-bold text-alert">{errors.stationIds}</p>}
      </fieldset>
      {carrierWideViewer && role === 'admin' && (
        <label className="flex items-center gap-2">
          <input type="checkbox" className="h-5 w-5" checked={carrierWide} onChange={(e) => setCarrierWide(e.target.checked)} />
          Carrier-wide admin: manages every user, at every station
        </label>
      )}
      {errors.carrierWide && <p className="font-bold text-alert">{errors.carrierWide}</p>}
      {errors.form && <p role="alert" className="font-bold text-alert">{errors.form}</p>}
      <div className="flex gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : user ? 'Save changes' : 'Create user'}
        </Button>
        <Button type="button" variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
