import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { User, UserList } from '@shared/schemas/users';
import { UsersAdmin } from './users-admin';

const station = (id: number, iata: string) => ({ id, iata, name: iata, timeZone: 'America/New_York' });
const user = (over: Partial<User>): User => ({
  id: 1, email: 'u@bumpboard.test', displayName: 'Una Fenwick', role: 'agent', active: true, stations: [station(1, 'BOS')], otherStations: 0,
  carrierWide: false, manageable: true, createdAt: '2026-12-01T08:00:00.000Z', ...over,
});
let list: UserList;

beforeEach(() => {
  vi.stubGlobal('fetch', (url: string) => {
    const path = url.replace(/^\/api/, '');
    const body = path === '/users' ? list : path === '/auth/session' ? { user: { id: 9, email: 'a@bumpboard.test', displayName: 'A', role: 'admin', stations: [station(1, 'BOS')] }, csrfToken: 'x', demo: true } : { error: 'not_found', message: path };
    return Promise.resolve(new Response(JSON.stringify(body), { status: body === list || path === '/auth/session' ? 200 : 404, headers: { 'Content-Type': 'application/json' } }));
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function show() {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={qc}>
      <UsersAdmin />
    </QueryClientProvider>,
  );
}

describe('users screen of a station admin', () => {
  it('shows only the admin’s part of a user who also works elsewhere, and offers no way to change them', async () => {
    list = {
      viewer: { carrierWide: false },
      users: [user({ id: 1, displayName: 'Una Fenwick' }), user({ id: 2, displayName: 'Otto Brackley', otherStations: 2, manageable: false })],
    };
    show();
    const shared = (await screen.findByText('Otto Brackley')).closest('tr')!;
    expect(within(shared).getByText('and 2 other stations')).toBeInTheDocument();
    expect(within(shared).queryByRole('button')).toBeNull();
    expect(within(shared).getByText('A carrier-wide admin manages this user')).toBeInTheDocument();
    const own = screen.getByText('Una Fenwick').closest('tr')!;
    expect(within(own).getByRole('button', { name: 'Edit' })).toBeEnabled();
    expect(screen.getByTestId('admin-scope')).toHaveTextContent(/only at your stations/);
  });

  it('tells a carrier-wide admin that they manage everyone', async () => {
    list = { viewer: { carrierWide: true }, users: [user({ carrierWide: true, role: 'admin' })] };
    show();
    expect(await screen.findByTestId('admin-scope')).toHaveTextContent(/carrier-wide admin/);
    expect(screen.getByText('Carrier-wide')).toBeInTheDocument();
  });
});
