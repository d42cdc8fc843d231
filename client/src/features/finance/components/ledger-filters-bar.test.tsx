import '@testing-library/jest-dom/vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { EMPTY_FILTERS } from '../model/ledger-filters';
import { LedgerFiltersBar } from './ledger-filters-bar';

afterEach(cleanup);

describe('the ledger’s filters, refused', () => {
  it('keep a "to" date before the "from" date as typed, apply nothing, and name the field in a summary that Enter focuses', async () => {
    const onChange = vi.fn();
    render(<LedgerFiltersBar stations={[]} filters={{ ...EMPTY_FILTERS, from: '2026-12-05' }} onChange={onChange} />);
    const to = screen.getByLabelText('Flights to');
    fireEvent.change(to, { target: { value: '2026-12-01' } });
    expect(onChange).not.toHaveBeenCalled();
    expect(to).toHaveValue('2026-12-01');
    const summary = screen.getByRole('alert');
    expect(summary).toHaveTextContent('Flights to: must not be before “Flights from”');
    fireEvent.keyDown(to, { key: 'Enter' });
    expect(summary).toHaveFocus();
    await userEvent.click(screen.getByRole('link', { name: 'Flights to' }));
    expect(to).toHaveFocus();
    fireEvent.change(to, { target: { value: '2026-12-09' } });
    expect(onChange).toHaveBeenLastCalledWith(expect.objectContaining({ from: '2026-12-05', to: '2026-12-09' }));
    expect(screen.queryByRole('alert')).toBeNull();
  });
});
