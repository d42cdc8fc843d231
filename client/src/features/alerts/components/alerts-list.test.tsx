import '@testing-library/jest-dom/vitest';
import { act, cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { AlertView } from '@shared/schemas/alerts';
import { alertKeys } from '../../../lib/alert-keys';
import { setPageTitle } from '../../../lib/document-title';
import { AlertsList } from './alerts-list';

// An invented alert at an invented station's desk (ZZ is the demo carrier).
const alert = (id: number, over: Partial<AlertView> = {}): AlertView => ({
  id, stationId: 7, stationIata: 'BOS', flightId: 1, flight: 'ZZ 105', serviceDate: '2026-03-10', compensationId: id, passengerName: 'Test Person',
  kind: 'payment-failed', message: 'The provider refused the card payment.', createdAt: '2026-03-10T18:00:00Z', resolvedAt: null, resolution: null,
  acknowledgedAt: null, acknowledgedBy: null, ...over,
});

function show(alerts: AlertView[]) {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity, refetchInterval: false } } });
  qc.setQueryData(alertKeys.list(7), { alerts });
  render(
    <QueryClientProvider client={qc}>
      <AlertsList stationId={7} hint="Re-issue from the flight." />
    </QueryClientProvider>,
  );
  return qc;
}

const chimes = vi.fn();
beforeEach(() => {
  localStorage.clear();
  setPageTitle('Station day · BOS');
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

describe('AlertsList', () => {
  it('puts the number of alerts nobody has taken on in the tab title, and clears it when the list leaves', () => {
    show([alert(1), alert(2), alert(3, { acknowledgedAt: '2026-03-10T18:05:00Z', acknowledgedBy: 'Sam' })]);
    expect(document.title).toBe('(2) Station day · BOS · Bumpboard');
    expect(screen.getByRole('heading', { name: /3 payments need attention/ })).toBeInTheDocument();
    cleanup();
    expect(document.title).toBe('Station day · BOS · Bumpboard');
  });

  it('stays silent by default, and chimes on a new alert once the user turns the sound on', async () => {
    const user = userEvent.setup();
    const qc = show([alert(1)]);
    const toggle = screen.getByRole('checkbox', { name: 'Sound when a new alert arrives' });
    expect(toggle).not.toBeChecked();
    act(() => qc.setQueryData(alertKeys.list(7), { alerts: [alert(1), alert(2)] }));
    await vi.waitFor(() => expect(document.title).toBe('(2) Station day · BOS · Bumpboard'));
    expect(chimes).not.toHaveBeenCalled();
    await user.click(screen.getByRole('checkbox', { name: 'Sound when a new alert arrives' }));
    expect(localStorage.getItem('bumpboard.alertSound')).toBe('on');
    act(() => qc.setQueryData(alertKeys.list(7), { alerts: [alert(1), alert(2), alert(3)] }));
    await vi.waitFor(() => expect(document.title).toBe('(3) Station day · BOS · Bumpboard'));
    expect(chimes).toHaveBeenCalled();
  });

  it('keeps the keyboard on the sound toggle when the first alert arrives and when the last one leaves', async () => {
    const qc = show([]);
    const toggle = screen.getByRole('checkbox', { name: 'Sound when a new alert arrives' });
    toggle.focus();
    act(() => qc.setQueryData(alertKeys.list(7), { alerts: [alert(1)] }));
    expect(await screen.findByRole('heading', { name: /1 payment needs attention/ })).toBeInTheDocument();
    // The same element, still focused: not a new toggle drawn in the alert panel while focus falls to the page body.
    expect(document.activeElement).toBe(toggle);
    act(() => qc.setQueryData(alertKeys.list(7), { alerts: [] }));
    expect(await screen.findByText('No alerts need attention.')).toBeInTheDocument();
    expect(document.activeElement).toBe(toggle);
  });
});
