import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Language } from '@shared/i18n';
import { LanguageProvider } from '../../../lib/language';
import { CardDetailsView } from './card-details-view';

// A made-up number that passes the Luhn check (ISO/IEC 7812-1 annex B, from memory).
const DETAILS = { number: '4000001234567899', cvc: '123', expMonth: 12, expYear: 2029, amountMinor: 45_000, currency: 'USD' };
const LINK = { state: 'ready', flight: 'ZZ 105', amountMinor: 45_000, currency: 'USD', expiresAt: '2026-12-04T12:00:00.000Z' };
const TOKEN = 'a'.repeat(43);

let revealAnswer: [number, unknown] = [200, DETAILS];
let linkAnswer: [number, unknown] = [200, LINK];
const calls: { url: string; body: Record<string, unknown>; credentials?: string }[] = [];
const json = (body: unknown, code = 200) => Promise.resolve(new Response(JSON.stringify(body), { status: code, headers: { 'Content-Type': 'application/json' } }));

beforeEach(() => {
  calls.length = 0;
  revealAnswer = [200, DETAILS];
  linkAnswer = [200, LINK];
  vi.stubGlobal('fetch', (url: string, init: RequestInit = {}) => {
    calls.push({ url, body: JSON.parse(String(init.body)), credentials: init.credentials });
    if (url.endsWith('/card-details/status')) return json(linkAnswer[1], linkAnswer[0]);
    if (url.endsWith('/card-details/reveal')) return json(revealAnswer[1], revealAnswer[0]);
    return json({ error: 'not_found', message: 'no stub' }, 404);
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const show = (language: Language = 'en') => render(
  <LanguageProvider initial={language}>
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}><CardDetailsView token={TOKEN} /></QueryClientProvider>
  </LanguageProvider>,
);

describe('the card-details page', () => {
  it('asks for the booking proof, then shows the details once, and keeps them out of the browser’s storage and the URL', async () => {
    show();
    await userEvent.type(await screen.findByLabelText('Booking reference'), 'k7q2xm');
    await userEvent.type(screen.getByLabelText('Last name'), 'Okafor');
    await userEvent.click(screen.getByRole('button', { name: 'Show my card details' }));
    expect(await screen.findByTestId('card-number')).toHaveTextContent('4000 0012 3456 7899');
    expect(screen.getByText('12/29')).toBeInTheDocument();
    const reveal = calls.find((c) => c.url.endsWith('/reveal'))!;
    expect(reveal).toMatchObject({ url: '/api/public/payments/card-details/reveal', body: { token: TOKEN, pnr: 'K7Q2XM', lastName: 'Okafor' }, credentials: 'omit' });
    expect(JSON.stringify({ ...localStorage }) + JSON.stringify({ ...sessionStorage })).not.toContain(DETAILS.number);
  });

  it('shows a clear page for a spent, expired or locked link, and none of the form', async () => {
    for (const [code, words] of [['link_used', 'already been used'], ['link_expired', 'has expired'], ['link_locked', 'is locked']] as const) {
      linkAnswer = [code === 'link_locked' ? 423 : 410, { error: code, message: 'refused' }];
      show();
      expect(await screen.findByTestId('link-problem')).toHaveTextContent(words);
      expect(screen.queryByRole('button', { name: 'Show my card details' })).toBeNull();
      cleanup();
    }
  });

  it('says plainly when the booking proof does not match, and the link is spent if another open won', async () => {
    show();
    revealAnswer = [403, { error: 'booking_not_matched', message: 'These booking details do not match this link. 4 tries left.' }];
    await userEvent.type(await screen.findByLabelText('Booking reference'), 'K7Q2XM');
    await userEvent.type(screen.getByLabelText('Last name'), 'Wrong');
    await userEvent.click(screen.getByRole('button', { name: 'Show my card details' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('do not match');
    revealAnswer = [410, { error: 'link_used', message: 'used' }];
    await userEvent.click(screen.getByRole('button', { name: 'Show my card details' }));
    expect(await screen.findByTestId('link-problem')).toHaveTextContent('already been used');
  });

  it('speaks the passenger’s language: the same page in French, money in French figures', async () => {
    show('fr');
    expect(await screen.findByLabelText('Référence de réservation')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Afficher les détails de ma carte' })).toBeInTheDocument();
    // CLDR French money (from memory): decimal comma, the code after the amount.
    expect(screen.getByText(/450,00/)).toHaveTextContent('vol ZZ 105');
  });

  it('opens in the booking’s language when the link says it, from an English start', async () => {
    linkAnswer = [200, { ...LINK, language: 'de' }];
    show('en');
    expect(await screen.findByRole('button', { name: 'Meine Kartendaten anzeigen' })).toBeInTheDocument();
  });
});
