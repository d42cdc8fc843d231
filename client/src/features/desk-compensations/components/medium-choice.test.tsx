import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import type { DeskCompensation } from '@shared/schemas/finance';
import { MediumChoice } from './medium-choice';

// An invented EU case: Art. 7(3) allows cash, bank transfer, bank order or cheque; the provider moves USD only.
const euCase = {
  id: 2, medium: 'cash', currency: 'EUR',
  payment: {
    terms: {
      media: ['cash', 'bank-transfer', 'cheque', 'prepaid-card', 'travel-credit'], needsAgreement: ['prepaid-card', 'travel-credit'], dueBy: null, dueStatus: null,
      ruleRef: 'Reg. (EC) 261/2004 Art. 7(3)', conditions: { value: 'any', writtenInformation: true, noExpiry: false, ruleRef: 'Art. 7(3)' }, restrictions: [], timeZone: 'Europe/Rome',
      unavailable: [{ medium: 'bank-transfer', reason: 'a bank transfer pays USD only; this compensation is owed in EUR' }],
    },
    agreement: null,
    counterPayment: null,
  },
} as unknown as DeskCompensation;

afterEach(cleanup);

describe('the media the desk can choose', () => {
  it('shows a lawful medium the provider cannot use here as unavailable, with why, instead of a choice refused once made', () => {
    render(<QueryClientProvider client={new QueryClient()}><MediumChoice flightId={7} compensation={euCase} /></QueryClientProvider>);
    expect(screen.getByRole('radio', { name: /Bank transfer/ })).toBeDisabled();
    expect(screen.getByRole('radio', { name: /Cash/ })).toBeEnabled();
    expect(screen.getByTestId('medium-unavailable')).toHaveTextContent(/cannot be used here: a bank transfer pays USD only; this compensation is owed in EUR/);
  });
});
