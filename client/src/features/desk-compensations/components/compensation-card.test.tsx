import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import type { DeskCompensation } from '@shared/schemas/finance';
import { CompensationCard } from './compensation-card';

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

const show = (c: DeskCompensation) =>
  render(<QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}><CompensationCard flightId={7} compensation={c} /></QueryClientProvider>);

afterEach(cleanup);

describe('the basis of a compensation, in words', () => {
  it('says "400 % of the fare, up to" the cap in force that day, never the engine code', () => {
    // 14 CFR 250.5(a)(3): 400 % of the one-way fare, cap $2,150 from 22 Jan 2025 (89 FR 84815).
    show(base);
    expect(screen.getByText(/^400 % of the fare, up to USD 2,150\.00/)).toBeInTheDocument();
    expect(document.body.textContent).not.toMatch(/us-400pct/);
  });

  it('names a volunteer’s accepted offer in words', () => {
    show({ ...base, sourceKind: 'volunteer', voluntary: true, band: 'posted offer', ruleRef: 'agreed with the volunteer' });
    expect(screen.getByText(/^Volunteer: the posted offer, accepted/)).toBeInTheDocument();
  });

  it('names a refund as a refund beside the compensation, with its rule, never as a band', () => {
    // 14 CFR Part 260, 260.1(a): fees for ancillary services paid for and not provided are refunded.
    show({ ...base, sourceKind: 'fee-refund', band: 'refund', ruleRef: '14 CFR 250.5(f): optional fees for services not received refunded', amountMinor: 7_500 });
    expect(screen.getByText(/^Refund — optional fees paid for services not received/)).toBeInTheDocument();
    expect(screen.getByText(/^Refund \(14 CFR/)).toBeInTheDocument();
  });
});
