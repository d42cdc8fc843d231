import '@testing-library/jest-dom/vitest';
import { act, cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { AlertView } from '@shared/schemas/alerts';
import { alertKeys } from '../../../lib/alert-keys';
import { setAlertSound } from '../../../lib/alert-sound';
import { setPageTitle } from '../../../lib/document-title';
import { AlertsBar } from './alerts-bar';

// Invented alerts at an invented station's desk (ZZ is the demo carrier).
const alert = (id: number, over: Partial<AlertView> = {}): AlertView => ({
  id, stationId: 7, stationIata: 'BOS', flightId: 1, flight: 'ZZ 105', serviceDate: '2026-03-10', compensationId: null, passengerName: null,
  kind: 'volunteer-offered', message: `ZZ 105: Passenger ${id} offered their seat from their phone.`, createdAt: '2026-03-10T18:00:00Z', resolvedAt: null,
  resolution: null, acknowledgedAt: null, acknowledgedBy: null, ...over,
});

function show(alerts: AlertView[], showPanel = true) {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity, refetchInterval: false } } });
  // No station: the bar asks for every station's alerts and joins no live room, so no socket opens in the test.
  qc.setQueryData(alertKeys.list(undefined), { alerts });
  const view = render(
    <QueryClientProvider client={qc}>
      <MemoryRouter>
        <AlertsBar stationId={null} listPath="/day?station=BOS" showPanel={showPanel} linkFlights />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return { qc, view };
}

const chimes = vi.fn();
beforeEach(() => {
  localStorage.clear();
  setPageTitle('Flight desk ZZ 105');
  chimes.mockReset();
  // A stand-in for the browser's audio: each tone started is one call.
  vi.stubGlobal('AudioContext', class {
    currentTime = 0;
    destination = {};
    createGain() { return { gain: { value: 0 }, connect: (x: unknown) => x }; }
    createOscillator() { return { frequency: { value: 0 }, connect: (x: unknown) => x, start: chimes, stop: () => {} }; }
    close() { return Promise.resolve(); }
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('AlertsBar', () => {
  it('counts the alerts nobody has taken on in the tab title, shows the newest three with their next step, and clears the title when it leaves', () => {
    show([alert(1), alert(2, { kind: 'approval-waiting', message: 'ZZ 105: an amount waits.' }), alert(3), alert(4), alert(5, { acknowledgedAt: '2026-03-10T18:05:00Z', acknowledgedBy: 'Sam' })]);
    expect(document.title).toBe('(4) Flight desk ZZ 105 · Bumpboard');
    const bar = screen.getByRole('region', { name: /4 alerts need you/ });
    const items = within(bar).getAllByTestId('alerts-bar-item');
    expect(items).toHaveLength(3);
    expect(within(items[0]).getByRole('button', { name: 'Dismiss alert 1' })).toBeInTheDocument();
    expect(within(items[1]).getByRole('button', { name: 'Mark alert 2 as seen' })).toBeInTheDocument();
    expect(within(items[1]).getByText(/A supervisor of the station approves or declines it on Station day/)).toBeInTheDocument();
    expect(within(items[0]).getByRole('link', { name: 'Open ZZ 105' })).toHaveAttribute('href', '/flights/1?station=BOS');
    expect(within(bar).getByRole('link', { name: 'See every alert' })).toHaveAttribute('href', '/day?station=BOS');
    expect(within(bar).getByText('1 more on the full list.')).toBeInTheDocument();
    expect(screen.getByTestId('alerts-spoken')).toHaveTextContent('4 alerts need you');
    cleanup();
    expect(document.title).toBe('Flight desk ZZ 105 · Bumpboard');
  });

  it('on a screen with the full list keeps only the title and the spoken count', () => {
    show([alert(1)], false);
    expect(screen.queryByRole('region')).not.toBeInTheDocument();
    expect(document.title).toBe('(1) Flight desk ZZ 105 · Bumpboard');
    expect(screen.getByTestId('alerts-spoken')).toHaveTextContent('1 alert needs you');
  });

  it('stays silent by default, and chimes for a rise once the user turned the sound on', async () => {
    const { qc } = show([alert(1)]);
    act(() => qc.setQueryData(alertKeys.list(undefined), { alerts: [alert(1), alert(2)] }));
    await vi.waitFor(() => expect(document.title).toBe('(2) Flight desk ZZ 105 · Bumpboard'));
    expect(chimes).not.toHaveBeenCalled();
    setAlertSound(true);
    act(() => qc.setQueryData(alertKeys.list(undefined), { alerts: [alert(1), alert(2), alert(3)] }));
    await vi.waitFor(() => expect(document.title).toBe('(3) Flight desk ZZ 105 · Bumpboard'));
    expect(chimes).toHaveBeenCalled();
    chimes.mockReset();
    // A fall (someone dismissed one) is no news.
    act(() => qc.setQueryData(alertKeys.list(undefined), { alerts: [alert(1), alert(2)] }));
    await vi.waitFor(() => expect(document.title).toBe('(2) Flight desk ZZ 105 · Bumpboard'));
    expect(chimes).not.toHaveBeenCalled();
  });

  it('dismisses an alert with its own button', async () => {
    const calls: string[] = [];
    vi.stubGlobal('fetch', vi.fn(async (url: string) => {
      calls.push(String(url));
      return new Response(JSON.stringify({ alert: { ...alert(1), acknowledgedAt: '2026-03-10T18:06:00Z', resolvedAt: '2026-03-10T18:06:00Z' } }), { status: 200, headers: { 'content-type': 'application/json' } });
    }));
    show([alert(1)]);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Dismiss alert 1' }));
    await vi.waitFor(() => expect(calls.some((u) => u.endsWith('/alerts/1/acknowledge'))).toBe(true));
  });
});
