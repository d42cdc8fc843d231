import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { DeskCompensation } from '@shared/schemas/finance';
import { CompensationCard } from './compensation-card';

// The payment forms, refused on submit: the shared summary takes focus, names the field by its label with the rule,
// and links to the field; nothing is sent.
const base: DeskCompensation = {
  id: 1, stationId: 1, stationIata: 'BOS', flightId: 7, flight: 'ZZ 105', serviceDate: '2025-03-01', passengerId: 3, passengerName: 'Ada Okafor',
  pnr: 'K7Q2XM', sourceKind: 'denial', regime: 'us-dot', voluntary: false, band: 'us-400pct', ruleRef: '14 CFR 250.5(a)(3)', form: 'prepaid-card', medium: 'cash', dueBy: '2025-03-02T04:59:59.999Z',
  amountMinor: 120_000, currency: 'USD', state: 'due', lastError: null, voidReason: null, voucherAgreedAt: null,
  createdAt: '2025-03-01T12:00:00Z', updatedAt: '2025-03-01T12:00:00Z', provider: null,
  voucher: { allowed: true, rule: 'r', cashAmountMinor: 120_000, currency: 'USD', restrictions: [], offeredAt: null, offerSentTo: null, agreedAt: null },
  payment: {
    terms: { media: ['cash', 'cheque', 'prepaid-card', 'travel-credit'], needsAgreement: ['prepaid-card', 'travel-credit'], dueBy: '2025-03-02T04:59:59.999Z', dueStatus: 'in-time', ruleRef: '14 CFR 250.8(a); 250.5(c)', conditions: { value: 'at-least', writtenInformation: true, noExpiry: false, ruleRef: '14 CFR 250.5(c)' }, restrictions: [], timeZone: 'America/New_York' },
    agreement: null,
    counterPayment: null,
  },
};

const posts: string[] = [];
beforeEach(() => {
  posts.length = 0;
  vi.stubGlobal('fetch', (url: string, init?: RequestInit) => {
    if (init?.method === 'POST') posts.push(url);
    return Promise.resolve(new Response('{}', { status: 200, headers: { 'Content-Type': 'application/json' } }));
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const show = (c: DeskCompensation) =>
  render(<QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}><CompensationCard flightId={7} compensation={c} /></QueryClientProvider>);

async function expectSummaryNaming(label: string, rule: RegExp, field: HTMLElement) {
  const summary = screen.getByRole('alert');
  expect(summary).toHaveFocus();
  expect(summary).toHaveTextContent(label);
  expect(summary).toHaveTextContent(rule);
  await userEvent.click(screen.getByRole('link', { name: label }));
  expect(field).toHaveFocus();
  expect(posts).toEqual([]);
}

describe('the error summary on the payment forms', () => {
  it('cash at the counter with no drawer named', async () => {
    show(base);
    await userEvent.click(screen.getByRole('button', { name: /^Record .* paid and signed for$/ }));
    await expectSummaryNaming('Drawer the cash comes from', /is required for cash/, screen.getByLabelText('Drawer the cash comes from'));
  });

  it('a prepaid card whose value is not an amount', async () => {
    show({ ...base, medium: 'prepaid-card' });
    const value = screen.getByLabelText('Value to the passenger (USD)');
    await userEvent.clear(value);
    await userEvent.type(value, 'lots');
    await userEvent.click(screen.getByRole('button', { name: 'Record the signed agreement' }));
    await expectSummaryNaming('Value to the passenger (USD)', /./, value);
  });
});
