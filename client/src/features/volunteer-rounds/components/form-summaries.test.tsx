import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Round, Volunteer, VolunteerPolicy } from '@shared/schemas/volunteers';
import type { PendingApproval } from '@shared/schemas/approvals';
import { AddVolunteer } from './add-volunteer';
import { OfferControl } from './offer-control';
import { OpenRoundForm } from './open-round-form';
import { PendingApprovals } from './pending-approvals';
import { RebookPanel } from './rebook-panel';

vi.mock('../../../lib/socket', () => ({ useLiveRoom: () => true }));

// Each gate form, refused on submit: the shared summary takes focus, names the field by its label with the rule, and
// links to the field; nothing is sent.
const POLICY: VolunteerPolicy = {
  currency: 'USD', ladderMinor: [20_000, 40_000, 60_000, 80_000], agentLimitMinor: 60_000, supervisorLimitMinor: null, raisePolicy: 'lift-to-new-offer', sealedBidPricing: 'own-ask',
  extras: [], voucherRestrictions: [],
};
const ROUND: Round = {
  id: 7, flightId: 4, kind: 'posted', status: 'open', currency: 'USD', offerMinor: 40_000, extras: [], volunteersNeeded: 2, accepted: 0,
  pendingApproval: null, openedBy: 'agent', openedAt: '2026-12-01T19:00:00.000Z', closedAt: null, volunteers: [],
};
const VOLUNTEER: Volunteer = {
  id: 5, bookingId: 10, pnr: 'K7Q2XM', names: ['Ada Okafor'], passengerIds: [1], askMinor: null, source: 'agent', status: 'accepted',
  agreedMinor: 40_000, acceptedAt: null, rebooking: null, pendingApproval: null, createdAt: '2026-12-01T19:05:00.000Z',
};
const PASSENGER = {
  id: 1, bookingId: 10, pnr: 'K7Q2XM', pnrSequence: 1, partySize: 1, firstName: 'Ada', lastName: 'Okafor', cabin: 'Y', fareMinor: 20_000, fareCurrency: 'USD', fareType: 'standard',
  ssrCodes: [], frequentFlyerTier: null, isChild: false, inboundFlight: null, inboundEstimatedArrival: null, status: 'checked-in', checkedInAt: null, boardedAt: null,
  showProbability: 1, why: '', seat: null,
};
const APPROVAL: PendingApproval = {
  id: 3, kind: 'raise', roundId: 7, flightId: 4, flight: 'ZZ 105', subject: null, offerMinor: 80_000, currency: 'USD', limitMinor: 60_000, requestedBy: 'agent@bumpboard.test', requestedAt: '2026-12-01T19:10:00.000Z',
};

const posts: string[] = [];
const json = (body: unknown, status = 200) => Promise.resolve(new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } }));

beforeEach(() => {
  posts.length = 0;
  vi.stubGlobal('fetch', (url: string, init?: RequestInit) => {
    const path = url.replace(/^\/api/, '');
    if (init?.method === 'POST') {
      posts.push(path);
      return json({}, 201);
    }
    if (path === '/flights/4/passengers') return json({ version: 1, passengers: [PASSENGER] });
    if (path === '/flights/4/alternates') return json({ alternates: [] });
    if (path.startsWith('/approvals')) return json({ approvals: [APPROVAL] });
    return json({ error: 'not_found', message: 'no stub' }, 404);
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const wrap = (ui: React.ReactNode) =>
  render(
    <MemoryRouter>
      <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>{ui}</QueryClientProvider>
    </MemoryRouter>,
  );

/** The summary has focus, says the label and the rule, and its link puts the keyboard in the named field. */
async function expectSummaryNaming(label: string, rule: RegExp, field: HTMLElement) {
  const summary = screen.getByRole('alert');
  expect(summary).toHaveFocus();
  expect(summary).toHaveTextContent(label);
  expect(summary).toHaveTextContent(rule);
  await userEvent.click(screen.getByRole('link', { name: label }));
  expect(field).toHaveFocus();
  expect(posts).toEqual([]);
}

describe('the error summary on the gate’s forms', () => {
  it('opening a round with no volunteers needed', async () => {
    wrap(<OpenRoundForm flightId={4} policy={POLICY} role="agent" volunteerTarget={2} />);
    const needed = screen.getByLabelText('Volunteers needed');
    await userEvent.clear(needed);
    await userEvent.type(needed, '0');
    await userEvent.click(screen.getByRole('button', { name: /^Open a volunteer round/ }));
    await expectSummaryNaming('Volunteers needed', /must be a whole number from 1 to 60/, needed);
  });

  it('raising to a custom amount below the current offer', async () => {
    wrap(<OfferControl round={ROUND} policy={POLICY} role="agent" flightId={4} timeZone="America/New_York" />);
    const amount = screen.getByLabelText('Custom amount (USD)');
    await userEvent.type(amount, '100');
    await userEvent.click(screen.getByRole('button', { name: 'Raise' }));
    await expectSummaryNaming('Custom amount (USD)', /must be above the current offer/, amount);
  });

  it('a counter volunteer’s sealed ask that is not an amount', async () => {
    wrap(<AddVolunteer round={{ ...ROUND, kind: 'sealed', offerMinor: null }} flightId={4} />);
    await userEvent.click(screen.getByRole('button', { name: 'Add a volunteer at the counter' }));
    await userEvent.type(screen.getByLabelText('Find by name or PNR'), 'okafor');
    await userEvent.click(await screen.findByLabelText(/Ada Okafor/));
    const ask = screen.getByLabelText('Their ask (USD)');
    await userEvent.type(ask, 'lots');
    await userEvent.click(screen.getByRole('button', { name: 'Record this volunteer' }));
    await expectSummaryNaming('Their ask (USD)', /./, ask);
  });

  it('rebooking by hand on a flight with no carrier', async () => {
    wrap(<RebookPanel volunteer={VOLUNTEER} flightId={4} timeZone="America/New_York" onDone={() => undefined} />);
    await userEvent.click(await screen.findByRole('button', { name: 'Another flight, entered by hand' }));
    await userEvent.type(screen.getByLabelText('Flight number'), '1905');
    await userEvent.click(screen.getByRole('button', { name: 'Hold the seat on this flight' }));
    await expectSummaryNaming('Carrier', /must be a 2-3 character airline designator/, screen.getByLabelText('Carrier'));
  });

  it('a supervisor rejecting an amount without a reason', async () => {
    wrap(<PendingApprovals stationId={1} timeZone="America/New_York" />);
    await userEvent.click(await screen.findByRole('button', { name: 'Reject' }));
    await expectSummaryNaming('Reason (needed to reject)', /must say why the amount is refused/, screen.getByLabelText('Reason (needed to reject)'));
  });
});
