import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Language } from '@shared/i18n';
import { LanguageProvider } from '../../../lib/language';
import { LanguageSwitch } from './language-switch';
import { OfferYourSeat } from './offer-your-seat';

const OFFER = {
  flight: { label: 'ZZ 105', destination: 'ORD', departure: '2026-12-01T20:45:00.000Z', timeZone: 'America/New_York' },
  round: { kind: 'posted', offerMinor: 40_000, currency: 'USD', extras: ['Meal voucher'] },
  disclosure: { mayBeDeniedInvoluntarily: true, involuntaryRule: 'US rules owe you 200 % of your fare.', cashAlternative: 'Paid in cash.', voucherRestrictions: ['Valid 12 months.'], ifTheOfferRises: 'You get the higher amount too.' },
};
const NOT_MATCHED = { error: 'booking_not_matched', message: 'We could not find that booking on this flight. Check the booking reference and the last name as printed on your boarding pass.' };

let status: Record<string, unknown> = { status: 'none', agreedMinor: null, currency: '', rebooking: null, message: 'You have not offered your seat on this flight.' };
const calls: { url: string; method: string; body: unknown; headers: Record<string, string> }[] = [];
let offerAnswer: [number, unknown] = [200, OFFER];

const json = (body: unknown, code = 200) => Promise.resolve(new Response(JSON.stringify(body), { status: code, headers: { 'Content-Type': 'application/json' } }));

beforeEach(() => {
  calls.length = 0;
  sessionStorage.clear();
  offerAnswer = [200, OFFER];
  vi.stubGlobal('fetch', (url: string, init: RequestInit = {}) => {
    const body = init.body ? JSON.parse(String(init.body)) : undefined;
    calls.push({ url, method: init.method ?? 'GET', body, headers: (init.headers ?? {}) as Record<string, string> });
    if (url === '/api/public/offers/tok.sig') return json(offerAnswer[1], offerAnswer[0]);
    if (url.endsWith('/identify')) {
      if (body.lastName === 'Rossi') return json({ passengerToken: 'passenger-token-2', names: ['Mario Rossi', 'Anna Rossi'], language: 'it' });
      return body.lastName === 'Okafor' && body.pnr === 'K7Q2XM' ? json({ passengerToken: 'passenger-token-1', names: ['Ada Okafor'] }) : json(NOT_MATCHED, 404);
    }
    if (url.endsWith('/bids')) {
      status = { status: 'offered', agreedMinor: null, currency: 'USD', rebooking: null, message: 'Thank you. Your offer is with the gate agent; please stay near the gate.' };
      return json({ status: 'offered' }, 201);
    }
    if (url.includes('/status?')) return json(status);
    return json({ error: 'not_found', message: 'no stub' }, 404);
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  status = { status: 'none', agreedMinor: null, currency: '', rebooking: null, message: '' };
});

const show = (language: Language = 'en') => render(
  <LanguageProvider initial={language}>
    <LanguageSwitch />
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}><OfferYourSeat token="tok.sig" /></QueryClientProvider>
  </LanguageProvider>,
);

describe('Offer your seat', () => {
  it('shows the flight, the offer and what the passenger must know before deciding', async () => {
    show();
    expect(await screen.findByTestId('offer-flight')).toHaveTextContent('ZZ 105 to ORD');
    expect(screen.getByTestId('offer-amount')).toHaveTextContent('$400.00');
    // 20:45 UTC on 1 December is 15:45 in New York (EST, UTC-5; 15 U.S.C. 260a).
    expect(screen.getByText('Leaves at 15:45 (local time)')).toBeInTheDocument();
    expect(screen.getByTestId('passenger-disclosure')).toHaveTextContent('US rules owe you 200 % of your fare.');
  });

  it('gives the same answer for a wrong name as the server does, then lets the passenger accept the posted offer', async () => {
    show();
    await userEvent.type(await screen.findByLabelText('Booking reference'), 'k7q2xm');
    await userEvent.type(screen.getByLabelText('Last name'), 'Okafr');
    await userEvent.click(screen.getByRole('button', { name: 'Continue' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(NOT_MATCHED.message);
    // The reference was sent in capitals, as the shared schema normalises it; no CSRF token, no cookies.
    const identify = calls.find((c) => c.url.endsWith('/identify'))!;
    expect(identify.body).toEqual({ pnr: 'K7Q2XM', lastName: 'Okafr' });
    expect(Object.keys(identify.headers)).not.toContain('X-CSRF-Token');

    await userEvent.clear(screen.getByLabelText('Last name'));
    await userEvent.type(screen.getByLabelText('Last name'), 'Okafor');
    await userEvent.click(screen.getByRole('button', { name: 'Continue' }));
    await userEvent.click(await screen.findByRole('button', { name: 'Accept $400.00 and take a later flight' }));
    expect(calls.find((c) => c.url.endsWith('/bids'))?.body).toEqual({ passengerToken: 'passenger-token-1', acceptPosted: true });
    expect(await screen.findByTestId('outcome')).toHaveAttribute('data-status', 'offered');
    expect(JSON.parse(sessionStorage.getItem('bumpboard.offer.tok.sig') ?? 'null')).toEqual({ passengerToken: 'passenger-token-1', names: ['Ada Okafor'] });
  });

  it('asks a sealed-bid passenger for the least they would accept, in minor units', async () => {
    offerAnswer = [200, { ...OFFER, round: { ...OFFER.round, kind: 'sealed', offerMinor: null } }];
    sessionStorage.setItem('bumpboard.offer.tok.sig', JSON.stringify({ passengerToken: 'passenger-token-1', names: ['Ada Okafor', 'Ben Okafor'] }));
    show();
    await userEvent.type(await screen.findByLabelText(/The least I would accept \(USD\), for each seat/), '$450');
    await userEvent.click(screen.getByRole('button', { name: 'Send my offer' }));
    expect(calls.find((c) => c.url.endsWith('/bids'))?.body).toEqual({ passengerToken: 'passenger-token-1', askMinor: 45_000 });
  });

  it('shows the accepted outcome with the new flight', async () => {
    status = { status: 'accepted', agreedMinor: 40_000, currency: 'USD', rebooking: { flight: 'ZZ 107', departure: '2026-12-02T02:05:00.000Z', arrival: '2026-12-02T04:50:00.000Z', plannedArrivalDelayMinutes: 320 }, message: 'Your offer was accepted.' };
    sessionStorage.setItem('bumpboard.offer.tok.sig', JSON.stringify({ passengerToken: 'passenger-token-1', names: ['Ada Okafor'] }));
    show();
    expect(await screen.findByTestId('new-flight')).toHaveTextContent('ZZ 107');
    // 02:05 UTC on 2 December is 21:05 on 1 December in New York (EST, UTC-5); derived: 320 min = 5 h 20 min.
    expect(screen.getByTestId('new-flight')).toHaveTextContent('Leaves at 21:05 (local time)');
    expect(screen.getByTestId('new-flight')).toHaveTextContent('Planned to arrive 5 hours 20 minutes later than your original flight.');
    expect(screen.queryByTestId('offer-box')).not.toBeInTheDocument();
  });

  it('tells the passenger to ask the gate agent when the link is tampered with, and keeps nothing', async () => {
    offerAnswer = [404, { error: 'link_invalid', message: 'This link is not valid any more.' }];
    sessionStorage.setItem('bumpboard.offer.tok.sig', JSON.stringify({ passengerToken: 'passenger-token-1', names: ['Ada Okafor'] }));
    show();
    expect(await screen.findByRole('heading', { name: 'This link does not work' })).toBeInTheDocument();
    expect(screen.getByText(/ask the gate agent/)).toBeInTheDocument();
    expect(screen.queryByLabelText('Booking reference')).not.toBeInTheDocument();
    expect(sessionStorage.length).toBe(0);
  });
});

describe('Offer your seat in the passenger\'s language', () => {
  it('starts in the language it is given (the browser\'s), with money and times in that language', async () => {
    show('fr');
    expect(await screen.findByTestId('offer-flight')).toHaveTextContent('ZZ 105 pour ORD');
    // CLDR fr: decimal comma, the code after the amount (from memory); 20:45Z is 15:45 in New York in December.
    expect(screen.getByTestId('offer-amount')).toHaveTextContent(/^400,00\s\$US$/);
    expect(screen.getByText('Départ à 15:45 (heure locale)')).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Avant de décider' })).toBeInTheDocument();
  });

  it('switches on the page when the passenger picks another language', async () => {
    show('en');
    await screen.findByTestId('offer-flight');
    await userEvent.selectOptions(screen.getByLabelText('Language'), 'de');
    expect(screen.getByTestId('offer-flight')).toHaveTextContent('ZZ 105 nach ORD');
    expect(screen.getByRole('heading', { name: 'Buchung finden' })).toBeInTheDocument();
    expect(screen.getByLabelText('Sprache')).toHaveValue('de');
  });

  it('takes the booking\'s language once the passenger is identified, with plural words for a party', async () => {
    show('en');
    await userEvent.type(await screen.findByLabelText('Booking reference'), 'K7Q2XM');
    await userEvent.type(screen.getByLabelText('Last name'), 'Rossi');
    await userEvent.click(screen.getByRole('button', { name: 'Continue' }));
    expect(await screen.findByRole('heading', { name: 'Buongiorno Mario Rossi' })).toBeInTheDocument();
    expect(screen.getByText(/Cederebbe i posti di tutte le persone della sua prenotazione: Mario Rossi e Anna Rossi\./)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: /^Accetta 400,00\sUSD e parti più tardi$/ })).toBeInTheDocument();
  });

  it('keeps the passenger\'s own pick over the booking\'s language', async () => {
    show('en');
    await screen.findByTestId('offer-flight');
    await userEvent.selectOptions(screen.getByLabelText('Language'), 'es');
    await userEvent.type(screen.getByLabelText('Código de reserva'), 'K7Q2XM');
    await userEvent.type(screen.getByLabelText('Apellido'), 'Rossi');
    await userEvent.click(screen.getByRole('button', { name: 'Continuar' }));
    expect(await screen.findByRole('heading', { name: 'Hola, Mario Rossi' })).toBeInTheDocument();
  });
});
