import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import type { SessionResponse } from '@shared/schemas/auth';
import type { Language } from '@shared/i18n';
import { LanguageProvider } from '../../lib/language';
import { sessionKeys } from '../../lib/session';
import { useCurrentStation } from '../use-current-station';
import { AppShell } from './app-shell';

// Two stations of one supervisor (invented staff; the airports are real IATA codes).
const SESSION: SessionResponse = {
  csrfToken: 'token',
  demo: false,
  user: {
    id: 1, email: 'sup@bumpboard.test', displayName: 'Sam Super', role: 'supervisor',
    stations: [{ id: 10, iata: 'BOS', name: 'Boston', timeZone: 'America/New_York' }, { id: 20, iata: 'YUL', name: 'Montréal', timeZone: 'America/Toronto' }],
  },
};

/** Stands in for any station page: it names the station it works on, read the same way every page reads it. */
function StationPage() {
  const { station } = useCurrentStation();
  return <p data-testid="page-station">{station?.iata}</p>;
}

function show(path: string, language: Language = 'en') {
  localStorage.clear();
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity } } });
  qc.setQueryData(sessionKeys.all, SESSION);
  const router = createMemoryRouter([{ path: '/', element: <AppShell />, children: [{ path: 'day', element: <StationPage /> }] }], { initialEntries: [path] });
  render(
    <LanguageProvider initial={language}>
      <QueryClientProvider client={qc}>
        <RouterProvider router={router} />
      </QueryClientProvider>
    </LanguageProvider>,
  );
  return router;
}

afterEach(cleanup);

describe('the station picker and the page', () => {
  it('take the station from the URL, both of them', async () => {
    show('/day?station=YUL');
    expect(await screen.findByTestId('page-station')).toHaveTextContent('YUL');
    expect(screen.getByTestId('station-picker')).toHaveValue('20');
  });

  it('write the working station into a URL that has none, or one the user does not belong to', async () => {
    const router = show('/day?station=LHR');
    expect(await screen.findByTestId('page-station')).toHaveTextContent('BOS');
    await expect.poll(() => router.state.location.search).toBe('?station=BOS');
  });

  it('move together when the picker changes: the URL changes, and the page follows it', async () => {
    const router = show('/day?station=BOS');
    await userEvent.selectOptions(await screen.findByTestId('station-picker'), '20');
    await expect.poll(() => router.state.location.search).toBe('?station=YUL');
    expect(screen.getByTestId('page-station')).toHaveTextContent('YUL');
    // The main navigation keeps the station when moving between pages.
    expect(screen.getByRole('link', { name: 'Station day' })).toHaveAttribute('href', '/day?station=YUL');
  });
});

describe('the shell on the message catalogues', () => {
  it('names the navigation from the catalogue of the language it is given', async () => {
    show('/day?station=BOS', 'fr');
    expect(await screen.findByRole('navigation', { name: 'Principal' })).toHaveTextContent('Journée de l’escale');
    expect(screen.getByRole('button', { name: 'Se déconnecter' })).toBeInTheDocument();
  });

  it('is in English for staff by default', async () => {
    show('/day?station=BOS');
    expect(await screen.findByRole('link', { name: 'Station day' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Planner' })).toBeInTheDocument();
  });
});
