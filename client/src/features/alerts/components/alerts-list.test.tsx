import '@testing-library/jest-dom/vitest';
import { act, cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import type { AlertView } from '@shared/schemas/alerts';
import { alertKeys } from '../../../lib/alert-keys';
import { setPageTitle } from '../../../lib/document-title';
import { AlertsList } from './alerts-list';

// Invented alerts at an invented station's desk (ZZ is the demo carrier).
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
      <MemoryRouter>
        <AlertsList stationId={7} hint="Newest first." />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return qc;
}

afterEach(() => {
  cleanup();
  localStorage.clear();
});

describe('AlertsList', () => {
  it('lists every alert with its next step; the tab title is the alerts bar’s, not the list’s', () => {
    setPageTitle('Station day · BOS');
    show([alert(1), alert(2, { kind: 'denial-proposed', compensationId: null, message: 'ZZ 105: a proposal waits.' }), alert(3, { acknowledgedAt: '2026-03-10T18:05:00Z', acknowledgedBy: 'Sam' })]);
    expect(screen.getByRole('heading', { name: /3 alerts need attention/ })).toBeInTheDocument();
    const [payment, proposal, seen] = screen.getAllByTestId('alert');
    expect(within(payment).getByText(/re-issue the payment/)).toBeInTheDocument();
    // A payment is re-issued from the compensation panel or the ledger; waiting work opens its flight.
    expect(within(payment).queryByRole('link')).not.toBeInTheDocument();
    expect(within(proposal).getByRole('link', { name: 'Open ZZ 105' })).toBeInTheDocument();
    expect(within(proposal).getByRole('button', { name: 'Mark alert 2 as seen' })).toHaveTextContent('I am on it');
    expect(within(seen).getByText(/seen by Sam/)).toBeInTheDocument();
    expect(within(seen).queryByRole('button')).not.toBeInTheDocument();
    expect(document.title).toBe('Station day · BOS · Bumpboard');
  });

  it('keeps the sound setting the bar reads', async () => {
    show([alert(1)]);
    await userEvent.setup().click(screen.getByRole('checkbox', { name: 'Sound when a new alert arrives' }));
    expect(localStorage.getItem('bumpboard.alertSound')).toBe('on');
  });

  it('keeps the keyboard on the sound toggle when the first alert arrives and when the last one leaves', async () => {
    const qc = show([]);
    const toggle = screen.getByRole('checkbox', { name: 'Sound when a new alert arrives' });
    toggle.focus();
    act(() => qc.setQueryData(alertKeys.list(7), { alerts: [alert(1)] }));
    expect(await screen.findByRole('heading', { name: /1 alert needs attention/ })).toBeInTheDocument();
    // The same element, still focused: not a new toggle drawn in the alert panel while focus falls to the page body.
    expect(document.activeElement).toBe(toggle);
    act(() => qc.setQueryData(alertKeys.list(7), { alerts: [] }));
    expect(await screen.findByText('No alerts need attention.')).toBeInTheDocument();
    expect(document.activeElement).toBe(toggle);
  });
});
