import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { ROLE_LABELS } from '@shared/schemas/common';
import type { User } from '@shared/schemas/users';
import { Button } from '../../../components/ui/button';
import { usersQueryOptions, useUpdateUser } from '../api/users';
import { UserForm } from './user-form';

export function UsersAdmin() {
  const { data, isPending, error } = useQuery(usersQueryOptions());
  const [editing, setEditing] = useState<User | 'new' | null>(null);
  const update = useUpdateUser();

  if (isPending) return <p className="text-ink-soft">Loading users…</p>;
  if (error) return <p role="alert" className="text-alert">{error.message}</p>;
  const carrierWide = data.viewer.carrierWide;

  return (
    <div className="space-y-4">
      <p className="text-ink-soft" data-testid="admin-scope">
        {carrierWide
          ? 'You are a carrier-wide admin: you manage every user, at every station.'
          : 'You manage the users who work only at your stations. A user who also works elsewhere is shown with your stations only, and only a carrier-wide admin can change them.'}
      </p>
      {editing ? (
        <UserForm user={editing === 'new' ? null : editing} carrierWideViewer={carrierWide} onDone={() => setEditing(null)} />
      ) : (
        <Button onClick={() => setEditing('new')}>Add a user</Button>
      )}
      {update.error && <p role="alert" className="font-bold text-alert">{update.error.message}</p>}
      <table className="w-full">
        <caption className="sr-only">{carrierWide ? 'Every user of the carrier' : 'Users of your stations'}</caption>
        <thead className="bg-harbour-soft text-left">
          <tr>
            <th className="px-2 py-2">Name</th>
            <th className="px-2 py-2">Role</th>
            <th className="px-2 py-2">Stations</th>
            <th className="px-2 py-2">Status</th>
            <th className="px-2 py-2">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {data.users.map((u) => (
            <tr key={u.id} className="border-t border-line">
              <td className="px-2 py-2">
                <span className="font-bold">{u.displayName}</span>
                <br />
                <span className="text-sm text-ink-soft">{u.email}</span>
              </td>
              <td className="px-2 py-2">
                {ROLE_LABELS[u.role]}
                {u.carrierWide && <span className="block text-sm font-bold">Carrier-wide</span>}
              </td>
              <td className="px-2 py-2">
                {u.stations.map((s) => s.iata).join(', ')}
                {u.otherStations > 0 && (
                  <span className="block text-sm text-ink-soft">
                    and {u.otherStations} other station{u.otherStations === 1 ? '' : 's'}
                  </span>
                )}
              </td>
              <td className="px-2 py-2">{u.active ? 'Active' : <span className="font-bold text-alert">Deactivated</span>}</td>
              <td className="px-2 py-2 text-right whitespace-nowrap">
                {u.manageable ? (
                  <ManageButtons user={u} onEdit={() => setEditing(u)} pending={update.isPending} toggle={() => update.mutate({ id: u.id, body: { active: !u.active } })} />
                ) : (
                  <span className="text-sm text-ink-soft">{u.carrierWide ? 'Carrier-wide admins manage this user' : 'A carrier-wide admin manages this user'}</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function ManageButtons({ user: u, onEdit, toggle, pending }: { user: User; onEdit: () => void; toggle: () => void; pending: boolean }) {
  return (
    <>
                <Button variant="quiet" onClick={onEdit}>
                  Edit
                </Button>
                <Button variant={u.active ? 'secondary' : 'quiet'} disabled={pending} onClick={toggle}>
                  {u.active ? 'Deactivate' : 'Reactivate'}
                </Button>
    </>
  );
}
