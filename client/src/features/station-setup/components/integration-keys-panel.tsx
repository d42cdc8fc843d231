import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { createIntegrationKeyBodySchema } from '@shared/schemas/integration-events';
import type { StationRef } from '../model/station-ref';
import { ApiRequestError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { integrationKeysQueryOptions, useCreateIntegrationKey, useRevokeIntegrationKey } from '../api/integration-keys';
import { formatStationDateTime } from '../model/format';

/** The new key, in full, shown once: only a hash is stored, so neither the list nor the server can show it again. */
function NewKeyBox({ name, secret, onDone }: { name: string; secret: string; onDone: () => void }) {
  const [copied, setCopied] = useState<'yes' | 'failed' | null>(null);
  async function copy() {
    try {
      await navigator.clipboard.writeText(secret);
      setCopied('yes');
    } catch {
      setCopied('failed');
    }
  }
  return (
    <section aria-label="New integration key" className="space-y-2 rounded-lg border-2 border-watch bg-watch-soft p-4">
      <h3 className="text-lg font-bold">Key “{name}” created</h3>
      <p className="font-bold">Copy it now: you will not see it again. Bumpboard keeps only a fingerprint of it.</p>
      <div className="flex flex-wrap items-center gap-2">
        <input
          readOnly
          aria-label="The new key"
          value={secret}
          onFocus={(e) => e.target.select()}
          className="min-w-0 flex-1 rounded-md border-2 border-ink bg-card px-3 py-2 font-mono text-base"
        />
        <Button type="button" onClick={copy}>
          Copy key
        </Button>
      </div>
      <p role="status" className="text-sm">
        {copied === 'yes' ? 'Copied to the clipboard.' : copied === 'failed' ? 'The browser did not allow copying: select the key and copy it by hand.' : ''}
      </p>
      <p className="text-sm">The departure-control system sends it as “Authorization: Bearer &lt;key&gt;” to /api/integrations/events.</p>
      <Button type="button" variant="secondary" onClick={onDone}>
        I have stored the key
      </Button>
    </section>
  );
}

export function IntegrationKeysPanel({ station }: { station: StationRef }) {
  const { data, isPending, error } = useQuery(integrationKeysQueryOptions(station.id));
  const create = useCreateIntegrationKey(station.id);
  const revoke = useRevokeIntegrationKey(station.id);
  const [name, setName] = useState('');
  const [nameError, setNameError] = useState<string>();
  const [created, setCreated] = useState<{ name: string; key: string } | null>(null);
  const [confirming, setConfirming] = useState<number | null>(null);

  async function submit(e: FormEvent) {
    e.preventDefault();
    const body = createIntegrationKeyBodySchema.safeParse({ name });
    if (!body.success) {
      setNameError(body.error.issues[0].message);
      return;
    }
    setNameError(undefined);
    try {
      const key = await create.mutateAsync(body.data.name);
      setCreated({ name: key.name, key: key.key });
      setName('');
    } catch (err) {
      setNameError(err instanceof ApiRequestError ? (err.fieldMessage('name') ?? err.message) : String(err));
    }
  }

  return (
    <div className="space-y-4">
      <p className="text-ink-soft">A key lets one departure-control system send check-in and boarding events for {station.iata}. Give each system its own key, so one can be revoked alone.</p>
      {created ? (
        <NewKeyBox name={created.name} secret={created.key} onDone={() => setCreated(null)} />
      ) : (
        <form onSubmit={submit} noValidate className="flex flex-wrap items-start gap-2" aria-label="New integration key">
          <TextField label="Key name" value={name} onChange={setName} error={nameError} hint="Which system uses it, e.g. “Gate system, terminal B”." className="min-w-56 flex-1" maxLength={60} />
          <Button type="submit" disabled={create.isPending} className="mt-8">
            {create.isPending ? 'Creating…' : 'Create key'}
          </Button>
        </form>
      )}

      {isPending ? (
        <p className="text-ink-soft">Loading keys…</p>
      ) : error ? (
        <p role="alert" className="text-alert">{error.message}</p>
      ) : data.keys.length === 0 ? (
        <p className="text-ink-soft">No keys yet for {station.iata}.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full">
            <caption className="sr-only">Integration keys of {station.iata}</caption>
            <thead className="bg-harbour-soft text-left">
              <tr>
                <th scope="col" className="px-2 py-2">Name</th>
                <th scope="col" className="px-2 py-2">Starts with</th>
                <th scope="col" className="px-2 py-2">Created</th>
                <th scope="col" className="px-2 py-2">Last used</th>
                <th scope="col" className="px-2 py-2">Status</th>
                <th scope="col" className="px-2 py-2"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {data.keys.map((k) => (
                <tr key={k.id} className={`border-t border-line align-top ${k.revokedAt ? 'text-ink-soft' : ''}`}>
                  <th scope="row" className="px-2 py-2 text-left font-bold">{k.name}</th>
                  <td className="px-2 py-2 font-mono">{k.prefix}…</td>
                  <td className="px-2 py-2 whitespace-nowrap">{formatStationDateTime(k.createdAt, station.timeZone)}</td>
                  <td className="px-2 py-2 whitespace-nowrap">{k.lastUsedAt ? formatStationDateTime(k.lastUsedAt, station.timeZone) : 'Never'}</td>
                  <td className="px-2 py-2">{k.revokedAt ? <span className="font-bold text-alert">Revoked {formatStationDateTime(k.revokedAt, station.timeZone)}</span> : <span className="font-bold text-calm">Active</span>}</td>
                  <td className="px-2 py-2 text-right">
                    {!k.revokedAt && confirming !== k.id && (
                      <Button variant="secondary" onClick={() => setConfirming(k.id)}>
                        Revoke
                      </Button>
                    )}
                    {confirming === k.id && (
                      <div role="group" aria-label={`Confirm revoking ${k.name}`} className="space-y-2 rounded-md border-2 border-alert bg-alert-soft p-2 text-left">
                        <p className="text-sm font-bold">Revoke “{k.name}”? The system using it is refused from the next request on. This cannot be undone.</p>
                        <div className="flex gap-2">
                          <Button variant="danger" disabled={revoke.isPending} onClick={() => revoke.mutate(k.id, { onSuccess: () => setConfirming(null) })}>
                            {revoke.isPending ? 'Revoking…' : 'Revoke key'}
                          </Button>
                          <Button variant="quiet" onClick={() => setConfirming(null)}>
                            Keep it
                          </Button>
                        </div>
                      </div>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {revoke.error && <p role="alert" className="font-bold text-alert">{revoke.error.message}</p>}
    </div>
  );
}
