import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { PassengerLinkView } from '@shared/schemas/payment-media';
import { NewLinkButton } from './new-link-button';

const show = (link: PassengerLinkView) =>
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } })}>
      <NewLinkButton flightId={7} compensationId={41} link={link} timeZone="America/New_York" />
    </QueryClientProvider>,
  );

const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('the desk’s "new link" button', () => {
  it('mails a new link for an expired payout link and says until when it works', async () => {
    const calls: { url: string; method: string }[] = [];
    vi.stubGlobal('fetch', vi.fn(async (url: string, init?: RequestInit) => {
      calls.push({ url: String(url), method: init?.method ?? 'GET' });
      return json(200, { link: { purpose: 'payout', expiresAt: '2026-03-13T18:00:00.000Z' } });
    }));
    show({ purpose: 'payout', state: 'expired', expiresAt: '2026-03-10T18:00:00.000Z', replaceable: true });
    expect(screen.getByTestId('passenger-link')).toHaveTextContent(/payout link .* expired at/);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Mail the passenger a new link' }));
    expect(await screen.findByRole('status')).toHaveTextContent(/A new link was mailed; it works until .*The old one no longer works/);
    expect(calls).toContainEqual({ url: expect.stringMatching(/\/api\/compensations\/41\/new-link$/), method: 'POST' });
  });

  it('offers no button once the link did its job (card shown or account given)', () => {
    show({ purpose: 'card-details', state: 'used', expiresAt: '2026-03-10T18:00:00.000Z', replaceable: false });
    expect(screen.getByTestId('passenger-link')).toHaveTextContent(/card-details link has done its job/);
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
  });

  it('shows the server’s refusal in its own words (too many new links in an hour)', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => json(429, { error: 'too_many_attempts', message: 'compensation: at most 3 new links an hour; please wait before sending another.' })));
    show({ purpose: 'card-details', state: 'locked', expiresAt: '2026-03-10T18:00:00.000Z', replaceable: true });
    await userEvent.setup().click(screen.getByRole('button', { name: 'Mail the passenger a new link' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('at most 3 new links an hour');
  });
});
