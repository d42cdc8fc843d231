import '@testing-library/jest-dom/vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Round, Volunteer } from '@shared/schemas/volunteers';
import { AddVolunteer } from './add-volunteer';
import { RebookPanel } from './rebook-panel';

const traveller = (id: number, bookingId: number, pnr: string, firstName: string, lastName: string, status = 'checked-in') => ({
  id, bookingId, pnr, pnrSequence: 1, partySize: 2, firstName, lastName, cabin: 'Y', fareMinor: 20_000, fareCurrency: 'USD', fareType: 'standard',
  ssrCodes: [], frequentFlyerTier: null, isChild: false, inboundFlight: null, inboundEstimatedArrival: null, status, checkedInAt: null, boardedAt: null,
  showProbability: 1, why: '', seat: null,
});
const PASSENGERS = [traveller(1, 10, 'K7Q2XM', 'Ada', 'Okafor'), traveller(2, 10, 'K7Q2XM', 'Ben', 'Okafor'), traveller(3, 11, 'ZZ9AB1', 'Cy', 'Okafor', 'boarded')];
const ROUND: Round = {
  id: 7, flightId: 4, kind: 'sealed', status: 'open', currency: 'USD', offerMinor: null, extras: [], volunteersNeeded: 2, accepted: 0,
  pendingApproval: null, openedBy: 'agent', openedAt: '2026-12-01T19:00:00.000Z', closedAt: null, volunteers: [],
};
const VOLUNTEER: Volunteer = {
  id: 5, bookingId: 10, pnr: 'K7Q2XM', names: ['Ada Okafor'], passengerIds: [1], askMinor: 30_000, source: 'agent', status: 'accepted',
  agreedMinor: 30_000, acceptedAt: null, rebooking: null, pendingApproval: null, createdAt: '2026-12-01T19:05:00.000Z',
};

const posts: { path: string; body: unknown }[] = [];
const json = (body: unknown, status = 200) => Promise.resolve(new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } }));

beforeEach(() => {
  posts.length = 0;
  vi.stubGlobal('fetch', (url: string, init?: RequestInit) => {
    const path = url.replace(/^\/api/, '');
    if (init?.method === 'POST') {
      posts.push({ path, body: JSON.parse(String(init.body ?? '{}')) });
      return json({ id: 1 }, 201);
    }
    if (path === '/flights/4/passengers') return json({ version: 1, passengers: PASSENGERS });
    if (path === '/flights/4/alternates') return json({ alternates: [{ id: 9, label: 'ZZ 107', departure: '2026-12-02T02:05:00.000Z', arrival: '2026-12-02T04:50:00.000Z', freeSeats: 0, plannedArrivalDelayMinutes: 320 }] });
    return json({ error: 'not_found', message: 'no stub' }, 404);
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const wrap = (ui: React.ReactNode) => render(<QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>{ui}</QueryClientProvider>);

describe('a volunteer at the counter', () => {
  it('records one member of a party as a split by choice, with their sealed ask; boarded people cannot volunteer', async () => {
    wrap(<AddVolunteer round={ROUND} flightId={4} />);
    await userEvent.click(screen.getByRole('button', { name: 'Add a volunteer at the counter' }));
    await userEvent.type(screen.getByLabelText('Find by name or PNR'), 'okafor');
    expect(await screen.findByLabelText(/Ben Okafor/)).toBeEnabled();
    expect(screen.getByLabelText(/Cy Okafor/)).toBeDisabled();
    await userEvent.click(screen.getByLabelText(/Ben Okafor/));
    await userEvent.type(screen.getByLabelText('Their ask (USD)'), '350');
    await userEvent.click(screen.getByRole('button', { name: 'Record this volunteer' }));
    expect(posts).toEqual([{ path: '/rounds/7/volunteers', body: { passengerIds: [2], askMinor: 35_000 } }]);
  });
});

describe('rebooking an accepted volunteer', () => {
  it('does not offer a full flight, and turns a hand-entered station time into UTC', async () => {
    wrap(<RebookPanel volunteer={VOLUNTEER} flightId={4} timeZone="America/New_York" onDone={() => undefined} />);
    expect(await screen.findByRole('button', { name: 'Hold a seat on ZZ 107' })).toBeDisabled();
    expect(screen.getByText('Full')).toBeInTheDocument();
    // Derived: 320 min = 5 h 20 min.
    expect(screen.getByText('5 h 20 min later')).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Another flight, entered by hand' }));
    await userEvent.type(screen.getByLabelText('Carrier'), 'zz');
    await userEvent.type(screen.getByLabelText('Flight number'), '1905');
    fireEvent.change(screen.getByLabelText(/^Departure · this station/), { target: { value: '2026-12-01T22:30' } });
    fireEvent.change(screen.getByLabelText(/^Arrival · the destination/), { target: { value: '2026-12-01T22:00' } });
    await userEvent.click(screen.getByRole('button', { name: 'Hold the seat on this flight' }));
    expect(screen.getByText('arrival must be after the departure')).toBeInTheDocument();
    expect(posts).toEqual([]);
    fireEvent.change(screen.getByLabelText(/^Arrival · the destination/), { target: { value: '2026-12-02T01:10' } });
    await userEvent.click(screen.getByRole('button', { name: 'Hold the seat on this flight' }));
    // New York is UTC-5 on 1 December (EST; 15 U.S.C. 260a): 22:30 local is 03:30 UTC the next day.
    expect(posts).toEqual([{ path: '/volunteers/5/rebook', body: { manual: { carrier: 'ZZ', number: '1905', departure: '2026-12-02T03:30:00.000Z', arrival: '2026-12-02T06:10:00.000Z' } } }]);
  });

  it('reads the arrival on the destination airport’s clock, not the station’s or the browser’s', async () => {
    wrap(<RebookPanel volunteer={VOLUNTEER} flightId={4} timeZone="America/New_York" arrival={{ airport: 'ORD', timeZone: 'America/Chicago' }} onDone={() => undefined} />);
    // Shown on Chicago's clock with its zone: 04:50 UTC is 22:50 CST (UTC-6 in December, IANA tz database).
    expect(await screen.findByText((_, el) => el?.tagName === 'P' && /arrives 22:50 CST/.test(el.textContent ?? ''))).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Another flight, entered by hand' }));
    await userEvent.type(screen.getByLabelText('Carrier'), 'qq');
    await userEvent.type(screen.getByLabelText('Flight number'), '88');
    fireEvent.change(screen.getByLabelText(/^Departure · this station/), { target: { value: '2026-12-01T22:30' } });
    fireEvent.change(screen.getByLabelText(/^Arrival · ORD local time/), { target: { value: '2026-12-02T00:10' } });
    await userEvent.click(screen.getByRole('button', { name: 'Hold the seat on this flight' }));
    // 22:30 EST (UTC-5) is 03:30 UTC; 00:10 CST (UTC-6) is 06:10 UTC: the same instants as the station-only reading above
    // would give only if both airports shared a zone (derived).
    expect(posts).toEqual([{ path: '/volunteers/5/rebook', body: { manual: { carrier: 'QQ', number: '88', departure: '2026-12-02T03:30:00.000Z', arrival: '2026-12-02T06:10:00.000Z' } } }]);
  });
});
