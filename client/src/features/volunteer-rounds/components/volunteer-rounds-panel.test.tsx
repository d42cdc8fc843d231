import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Round, Volunteer, VolunteerPolicy } from '@shared/schemas/volunteers';
import { VolunteerRoundsPanel } from './volunteer-rounds-panel';

// The panel watches the flight's room; the socket itself is not under test here.
vi.mock('../../../lib/socket', () => ({ useLiveRoom: () => true }));

const POLICY: VolunteerPolicy = {
  currency: 'USD', ladderMinor: [20_000, 40_000, 60_000, 80_000], agentLimitMinor: 60_000, supervisorLimitMinor: null, raisePolicy: 'lift-to-new-offer', sealedBidPricing: 'own-ask',
  extras: ['Meal voucher'], voucherRestrictions: ['Valid for 12 months.'],
};
const volunteer = (over: Partial<Volunteer>): Volunteer => ({
  id: 1, bookingId: 1, pnr: 'AAA111', names: ['Ada Okafor'], passengerIds: [1], askMinor: null, source: 'passenger-link', status: 'offered',
  agreedMinor: null, acceptedAt: null, rebooking: null, pendingApproval: null, createdAt: '2026-12-01T19:05:00.000Z', ...over,
});
const round = (over: Partial<Round>): Round => ({
  id: 7, flightId: 4, kind: 'posted', status: 'open', currency: 'USD', offerMinor: 60_000, extras: [], volunteersNeeded: 2, accepted: 0,
  pendingApproval: null, openedBy: 'agent@bumpboard.test', openedAt: '2026-12-01T19:00:00.000Z', closedAt: null, volunteers: [], ...over,
});

let role = 'agent';
let rounds: Round[] = [];
const posts: { path: string; body: unknown }[] = [];

function json(body: unknown, status = 200) {
  return Promise.resolve(new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } }));
}

beforeEach(() => {
  posts.length = 0;
  vi.stubGlobal('fetch', (url: string, init?: RequestInit) => {
    const path = url.replace(/^\/api/, '');
    if (init?.method === 'POST') {
      posts.push({ path, body: JSON.parse(String(init.body ?? '{}')) });
      return json({ approvalRequested: true });
    }
    if (path === '/auth/session') return json({ user: { id: 1, email: 'a@b.test', displayName: 'A', role, stations: [] }, csrfToken: 'x', demo: true });
    if (path === '/flights/4/rounds') return json({ rounds, policy: POLICY, bidLink: 'http://127.0.0.1:4600/offer/abc.def' });
    if (path.startsWith('/public/offers/')) {
      return json({ flight: { label: 'ZZ 105', destination: 'ORD', departure: '2026-12-01T20:45:00.000Z', timeZone: 'America/New_York' }, round: null, disclosure: { mayBeDeniedInvoluntarily: true, involuntaryRule: 'US rules owe you 200 %.', cashAlternative: 'Cash or equivalent.', voucherRestrictions: ['Valid for 12 months.'], ifTheOfferRises: 'You get the higher amount too.' } });
    }
    return json({ error: 'not_found', message: `no stub for ${path}` }, 404);
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function show(forecast = { volunteerTarget: 3 }) {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={qc}>
      <VolunteerRoundsPanel flightId={4} station={{ id: 1, timeZone: 'America/New_York' }} forecast={forecast} />
    </QueryClientProvider>,
  );
}

describe('VolunteerRoundsPanel', () => {
  it('opens a posted round at the ladder’s first step, with the forecast’s volunteer target', async () => {
    rounds = [];
    show();
    expect(await screen.findByLabelText('First offer')).toHaveValue('20000');
    expect(screen.getByLabelText('Volunteers needed')).toHaveValue(3);
    // $800 is above the $600 agent limit: an agent may open there, and it waits for a supervisor.
    expect(screen.getByRole('option', { name: /\$800\.00 — above your limit: waits for a supervisor/ })).toBeEnabled();
    await userEvent.click(screen.getByRole('button', { name: 'Open a volunteer round at $200.00' }));
    expect(posts).toEqual([{ path: '/flights/4/rounds', body: { kind: 'posted', offerMinor: 20_000, extras: ['Meal voucher'], volunteersNeeded: 3 } }]);
  });

  it('shows progress, the next step as needing a supervisor, and who is waiting', async () => {
    rounds = [round({ accepted: 1, volunteers: [volunteer({ status: 'accepted', agreedMinor: 60_000 }), volunteer({ id: 2, bookingId: 2, pnr: 'BBB222', names: ['Bo Young', 'Cy Young'], passengerIds: [2, 3] })] })];
    show();
    expect(await screen.findByTestId('round-progress')).toHaveTextContent('1 of 2 seats found');
    expect(screen.getByTestId('current-offer')).toHaveTextContent('$600.00');
    await userEvent.click(screen.getByRole('button', { name: 'Raise to $800.00 (needs a supervisor)' }));
    expect(posts.at(-1)).toEqual({ path: '/rounds/7/raise', body: { offerMinor: 80_000 } });
    // A party of two does not fit in the one seat left: accepting it is not offered.
    const party = screen.getAllByTestId('volunteer-row').find((r) => r.dataset.pnr === 'BBB222')!;
    expect(within(party).getByRole('button', { name: /^Accept/ })).toBeDisabled();
    expect(party).toHaveTextContent('this party of 2 does not fit');
    expect(await screen.findByTestId('disclosure')).toHaveTextContent('US rules owe you 200 %.');
    expect(screen.getByTestId('disclosure')).toHaveTextContent('If the offer rises: You get the higher amount too.');
  });

  it('lists sealed asks as the server sorts them and says the pricing rule; a supervisor raises alone', async () => {
    role = 'supervisor';
    rounds = [round({ kind: 'sealed', offerMinor: null, volunteers: [volunteer({ askMinor: 30_000 }), volunteer({ id: 2, bookingId: 2, pnr: 'BBB222', askMinor: 45_000 })] })];
    show();
    const rows = await screen.findAllByTestId('volunteer-row');
    expect(rows.map((r) => r.dataset.pnr)).toEqual(['AAA111', 'BBB222']);
    expect(within(rows[0]).getByRole('button', { name: 'Accept at $300.00' })).toBeEnabled();
    expect(screen.getByText(/Each accepted volunteer is paid their own ask/)).toBeInTheDocument();
    role = 'agent';
  });

  it('says plainly when a raise waits for a supervisor', async () => {
    rounds = [round({ pendingApproval: { id: 3, kind: 'raise', offerMinor: 80_000, requestedBy: 'agent@bumpboard.test', requestedAt: '2026-12-01T19:10:00.000Z' } })];
    show();
    // 19:10 UTC is 14:10 in New York on 1 December (EST, UTC-5; 15 U.S.C. 260a).
    expect(await screen.findByTestId('pending-approval')).toHaveTextContent('Awaiting approval: a supervisor must approve $800.00 (asked by agent@bumpboard.test at 14:10)');
    expect(screen.getByRole('button', { name: 'Raise to $800.00 (needs a supervisor)' })).toBeDisabled();
  });

  it('shows a sealed bid that waits for a supervisor instead of its Accept button', async () => {
    rounds = [round({ kind: 'sealed', offerMinor: null, volunteers: [volunteer({ askMinor: 90_000, pendingApproval: { id: 4, offerMinor: 90_000, requestedBy: 'agent@bumpboard.test', requestedAt: '2026-12-01T19:12:00.000Z' } })] })];
    show();
    expect(await screen.findByTestId('volunteer-awaiting-approval')).toHaveTextContent('Awaiting approval: a supervisor must approve accepting at $900.00');
    expect(screen.queryByRole('button', { name: /^Accept/ })).toBeNull();
  });

  it('offers no accept while a round’s opening offer waits for a supervisor', async () => {
    rounds = [round({ offerMinor: null, pendingApproval: { id: 5, kind: 'opening-offer', offerMinor: 80_000, requestedBy: 'agent@bumpboard.test', requestedAt: '2026-12-01T19:10:00.000Z' }, volunteers: [volunteer({})] })];
    show();
    expect(await screen.findByTestId('pending-approval')).toHaveTextContent('No one can be accepted until an offer stands.');
    expect(screen.getByRole('button', { name: /^Accept/ })).toBeDisabled();
  });
});
