import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import { passenger } from '../model/test-passenger';
import { PassengerList } from './passenger-list';

const DEP = '2026-03-10T18:35:00Z';
const list = [
  passenger({ id: 1, pnr: 'AAA111', firstName: 'Ada', lastName: 'Zeller', status: 'booked', showProbability: 0.9, fareMinor: 21200 }),
  passenger({ id: 2, pnr: 'BBB222', firstName: 'Bo', lastName: 'Young', cabin: 'J', status: 'checked-in', showProbability: 1, ssrCodes: ['WCHR'] }),
  passenger({ id: 3, pnr: 'CCC333', firstName: 'Cy', lastName: 'Xu', status: 'boarded', showProbability: 0.7, inboundFlight: 'ZZ318', inboundEstimatedArrival: '2026-03-10T18:05:00Z' }),
];

afterEach(cleanup);

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
    const search = screen.getByLabelText('Search name or PNR');
    await userEvent.type(search, 'bbb2');
    expect(names()).toEqual(['YOUNG, Bo']);
    expect(screen.getByTestId('passenger-count')).toHaveTextContent('Showing 1 of 3 passengers');
    await userEvent.clear(search);
    await userEvent.type(search, 'ada zel');
    expect(names()).toEqual(['ZELLER, Ada']);
  });

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
});
