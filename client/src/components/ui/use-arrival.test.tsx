import '@testing-library/jest-dom/vitest';
import { act, cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, Link, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import { setAlertCount } from '../../lib/document-title';
import { Page } from './page';

afterEach(() => {
  cleanup();
  setAlertCount(0);
});

function show() {
  const router = createMemoryRouter(
    [
      { path: '/a', element: <Page title="Departures · ZZ1"><Link to="/b">Open flight</Link><input aria-label="Search" /></Page> },
      { path: '/b', element: <Page title="Flight desk · ZZ 101"><p>desk</p></Page> },
    ],
    { initialEntries: ['/a'] },
  );
  render(<RouterProvider router={router} />);
  return router;
}

describe('arriving on a screen', () => {
  it('names the tab after the screen and focuses its heading, on first load and after a route change', async () => {
    const user = userEvent.setup();
    show();
    expect(document.title).toBe('Departures · ZZ1 · Bumpboard');
    expect(screen.getByRole('heading', { level: 1, name: 'Departures · ZZ1' })).toHaveFocus();
    await user.click(screen.getByRole('link', { name: 'Open flight' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Flight desk · ZZ 101' })).toHaveFocus();
    expect(document.title).toBe('Flight desk · ZZ 101 · Bumpboard');
  });

  it('treats a new navigation to the same screen as a new arrival', async () => {
    const user = userEvent.setup();
    const router = show();
    await user.click(screen.getByRole('textbox', { name: 'Search' }));
    await act(() => router.navigate('/a', { replace: true, state: null, preventScrollReset: true }));
    // A new navigation is a new arrival: focus goes to the heading, not left on a control that may be gone.
    expect(screen.getByRole('heading', { level: 1 })).toHaveFocus();
  });

  it('puts the number of waiting alerts in front of the tab title', () => {
    show();
    act(() => setAlertCount(3));
    expect(document.title).toBe('(3) Departures · ZZ1 · Bumpboard');
  });
});
