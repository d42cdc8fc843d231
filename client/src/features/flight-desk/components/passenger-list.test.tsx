import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { passenger } from '../model/test-passenger';
import { PassengerList } from './passenger-list';

const DEP = '2026-03-10T18:35:00Z';
const list = [
  passenger({ id: 1, pnr: 'AAA111', firstName: 'Ada', lastName: 'Zeller', status: 'booked', showProbability: 0.9, fareMinor: 21200 }),
  passenger({ id: 2, pnr: 'BBB222', firstName: 'Bo', lastName: 'Young', cabin: 'J', status: 'checked-in', showProbability: 1, ssrCodes: ['WCHR'], seat: '2A' }),
  passenger({ id: 3, pnr: 'CCC333', firstName: 'Cy', lastName: 'Xu', status: 'boarded', showProbability: 0.7, inboundFlight: 'ZZ318', inboundEstimatedArrival: '2026-03-10T18:05:00Z' }),
];

afterEach(cleanup);

// jsdom lays nothing out: give the list the size of a desk's (600 px high) and each row 48 px, so the virtual list
// draws a screenful as a browser would.
const sizes = { clientHeight: 600, clientWidth: 1200 } as const;
const original = Object.keys(sizes).map((k) => Object.getOwnPropertyDescriptor(Element.prototype, k));
beforeAll(() => {
  Object.defineProperty(HTMLTableRowElement.prototype, 'offsetHeight', { configurable: true, get: () => 48 });
  for (const [k, v] of Object.entries(sizes)) Object.defineProperty(Element.prototype, k, { configurable: true, get: () => v });
});
afterAll(() => {
  delete (HTMLTableRowElement.prototype as { offsetHeight?: number }).offsetHeight;
  Object.keys(sizes).forEach((k, i) => original[i] && Object.defineProperty(Element.prototype, k, original[i]!));
});

const names = () => screen.getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell')[0].textContent);
const show = () => render(<PassengerList passengers={list} timeZone="America/New_York" departureIso={DEP} />);

describe('PassengerList', () => {
  it('lists everyone sorted by last name, with money from minor units and times in the station zone', () => {
    show();
    expect(screen.getByTestId('passenger-count')).toHaveTextContent('3 passengers');
    expect(names()).toEqual(['XU, Cy', 'YOUNG, Bo', 'ZELLER, Ada']);
    // 21200 minor units of USD is $212.00 (ISO 4217: USD has 2 decimals).
    expect(screen.getByText('$212.00')).toBeInTheDocument();
    // 18:05 UTC is 14:05 in New York on 10 March 2026 (EDT, UTC-4, from the second Sunday of March, 15 U.S.C. 260a).
    expect(screen.getByText(/lands 14:05/)).toBeInTheDocument();
    // Derived: 18:35 - 18:05 is 30 minutes, under the 45-minute tight-connection line.
    expect(screen.getByText(/30 min to connect/)).toHaveClass('text-alert');
  });

  it('sorts by show odds when the header is clicked, and says so to assistive technology', async () => {
    show();
    const header = screen.getByRole('button', { name: /Show odds/ });
    await userEvent.click(header);
    // Numbers sort largest first on the first click (the table's default for numeric columns), then flip.
    expect(names()).toEqual(['YOUNG, Bo', 'ZELLER, Ada', 'XU, Cy']);
    expect(header.closest('th')).toHaveAttribute('aria-sort', 'descending');
    await userEvent.click(header);
    expect(names()).toEqual(['XU, Cy', 'ZELLER, Ada', 'YOUNG, Bo']);
    expect(header.closest('th')).toHaveAttribute('aria-sort', 'ascending');
  });

  it('finds by PNR and by name', async () => {
    show();
    const search = screen.getByLabelText('Search name, PNR or seat');
    await userEvent.type(search, 'bbb2');
    expect(names()).toEqual(['YOUNG, Bo']);
    expect(screen.getByTestId('passenger-count')).toHaveTextContent('Showing 1 of 3 passengers');
    await userEvent.clear(search);
    await userEvent.type(search, 'ada zel');
    expect(names()).toEqual(['ZELLER, Ada']);
  });

  it('shows each seat, or that none is assigned yet, and finds by seat', async () => {
    show();
    expect(screen.getByText('Seat', { selector: 'th, th *' })).toBeInTheDocument();
    expect(screen.getAllByText('none yet')).toHaveLength(2);
    await userEvent.type(screen.getByLabelText('Search name, PNR or seat'), '2a');
    expect(names()).toEqual(['YOUNG, Bo']);
    expect(screen.getByText('2A')).toBeInTheDocument();
    // A generous limit: the first test of a run also pays for the table's warm-up on a shared machine.
  }, 20_000);

  it('filters by status, cabin, connection and SSR, and clears them all at once', async () => {
    show();
    await userEvent.selectOptions(screen.getByLabelText('Status'), 'not-boarded');
    expect(names()).toEqual(['YOUNG, Bo', 'ZELLER, Ada']);
    await userEvent.selectOptions(screen.getByLabelText('Cabin'), 'J');
    expect(names()).toEqual(['YOUNG, Bo']);
    await userEvent.selectOptions(screen.getByLabelText('SSR'), 'any');
    expect(names()).toEqual(['YOUNG, Bo']);
    await userEvent.selectOptions(screen.getByLabelText('Connection'), 'connecting');
    expect(screen.getByText('No passenger matches these filters.')).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Clear filters' }));
    expect(names()).toHaveLength(3);
  });

  it('keeps only the rows in view in the page at 850 passengers, tells screen readers the full count, and search reaches the last one', async () => {
    const user = userEvent.setup();
    // A wide-body's worth of invented passengers, named so that sorting by name keeps this order.
    const many = Array.from({ length: 850 }, (_, i) => passenger({ id: i + 1, bookingId: i + 1, pnr: `P${String(i).padStart(5, '0')}`, lastName: `Name${String(i).padStart(4, '0')}`, firstName: 'Test' }));
    render(<PassengerList passengers={many} timeZone="America/New_York" departureIso={DEP} />);
    expect(screen.getByTestId('passenger-count')).toHaveTextContent('850 passengers');
    const table = screen.getByRole('table');
    expect(table).toHaveAttribute('aria-rowcount', '851');
    const drawn = screen.getAllByRole('row').length - 1;
    expect(drawn).toBeGreaterThan(0);
    expect(drawn).toBeLessThan(60);
    await user.type(screen.getByLabelText('Search name, PNR or seat'), 'P00849');
    expect(screen.getByTestId('passenger-count')).toHaveTextContent('Showing 1 of 850 passengers');
    expect(names()).toEqual(['NAME0849, Test']);
  });
});
