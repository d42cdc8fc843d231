// Required content: 14 CFR 250.9 (from memory: compensation, volunteers and boarding priorities,
// exceptions, amounts, method of payment, passenger options); Reg. 261/2004 Art. 14(2) (Art. 7, 8, 9 and
// the enforcement body); SOR/2019-150 (amounts, 48 h payment, top-up, recourse, from memory).
import { describe, expect, it } from 'vitest';
import { compensationDue } from '../index';
import type { PriorityRuleInput } from '../../denial/priority-rules.schema';
import {
  CAUTION_HEADING,
  statementHtml,
  statementText,
  writtenStatement,
  type StatementInput,
} from './index';

const RULES: PriorityRuleInput[] = [
  { factor: 'check-in-time', direction: 'latest-first' },
  { factor: 'fare-paid', direction: 'lowest-first' },
];

const usInput: StatementInput = {
  regime: 'us-dot',
  carrierName: 'Example Air',
  station: 'ORD',
  passenger: { name: 'Ada Lovelace', pnr: 'ABC123', ticketNumber: '0001234567890' },
  flight: { number: 'XX100', date: '2025-03-01', origin: 'ORD', destination: 'DEN', scheduledArrival: '2025-03-01 11:20 local' },
  alternate: { flightNumber: 'XX104', plannedArrival: '2025-03-01 14:20 local' },
  compensation: compensationDue({
    regime: 'us-dot', deniedOn: '2025-03-01', oneWayFare: { amountMinor: 30_000, currency: 'USD' }, plannedArrivalDelayMinutes: 180, aircraftSeats: 150,
  }),
  priorityRules: RULES,
};

const euInput: StatementInput = {
  ...usInput,
  regime: 'eu-261',
  station: 'FCO',
  flight: { number: 'XX200', date: '2025-03-01', origin: 'FCO', destination: 'HAM' },
  compensation: compensationDue({ regime: 'eu-261', deniedOn: '2025-03-01', distanceKm: 1326, intraCommunity: true, plannedArrivalDelayMinutes: 150 }),
  enforcementBody: { name: 'Example national enforcement body', website: 'enforcement.example', email: 'claims@enforcement.example' },
};

const headings = (input: StatementInput) => writtenStatement(input).sections.map((section) => section.heading);
const bodyOf = (input: StatementInput, heading: string) => writtenStatement(input).sections.find((section) => section.heading === heading)?.body ?? '';

describe('us-dot statement: the content 14 CFR 250.9 requires', () => {
  it('has every required section and ends with the caution', () => {
    expect(headings(usInput)).toEqual([
      'Compensation for denied boarding',
      'Your case',
      'Volunteers and boarding priorities',
      'Exceptions: when no compensation is due',
      'Amount of compensation',
      'Alternate transportation',
      'Method of payment',
      'Your options',
      CAUTION_HEADING,
    ]);
  });

  it('inserts the carrier boarding priorities (§250.9 "volunteers and boarding priorities")', () => {
    const body = bodyOf(usInput, 'Volunteers and boarding priorities');
    expect(body).toContain('- 1. Check-in time');
    expect(body).toContain('- 2. Fare paid');
  });

  it('states the caps in force (89 FR 84815: $1,075 / $2,150) and the passenger amount', () => {
    const body = bodyOf(usInput, 'Amount of compensation');
    expect(body).toContain('USD 1,075.00');
    expect(body).toContain('USD 2,150.00');
    expect(body).toContain('Your compensation: USD 1,200.00');
  });

  it('lists the §250.6 exceptions, cash or cheque, and the options', () => {
    expect(bodyOf(usInput, 'Exceptions: when no compensation is due')).toContain('60 seats or fewer');
    expect(bodyOf(usInput, 'Method of payment')).toContain('cash or by cheque');
    expect(bodyOf(usInput, 'Your options')).toContain('court');
  });

  it('a voucher must be worth at least the cash amount (§250.5(c)), and the cash amount is stated', () => {
    expect(() => writtenStatement({ ...usInput, voucherOffer: { valueMinor: 100_000, currency: 'USD' } })).toThrow(/^voucherOffer\.valueMinor:/);
    const body = bodyOf({ ...usInput, voucherOffer: { valueMinor: 150_000, currency: 'USD', restrictions: 'valid 1 year' } }, 'Method of payment');
    expect(body).toContain('USD 1,500.00');
    expect(body).toContain('You may refuse it and receive USD 1,200.00');
  });
});

describe('eu-261 notice: Art. 14(2)', () => {
  it('sets out Art. 7, 8, 9 and the enforcement body, then the caution', () => {
    const list = headings(euInput);
    for (const heading of ['Compensation (Article 7)', 'Reimbursement or re-routing (Article 8)', 'Care while you wait (Article 9)', 'Enforcement body']) {
      expect(list).toContain(heading);
    }
    expect(list.at(-1)).toBe(CAUTION_HEADING);
    expect(bodyOf(euInput, 'Enforcement body')).toContain('claims@enforcement.example');
    expect(bodyOf(euInput, 'Compensation (Article 7)')).toContain('EUR 600.00');
  });

  it('refuses to issue without the enforcement body contact (Art. 14(2))', () => {
    expect(() => writtenStatement({ ...euInput, enforcementBody: undefined })).toThrow(/^enforcementBody:/);
  });
});

describe('uk-261 notice', () => {
  const ukInput: StatementInput = {
    ...euInput,
    regime: 'uk-261',
    enforcementBody: undefined,
    compensation: compensationDue({ regime: 'uk-261', deniedOn: '2025-03-01', distanceKm: 900, plannedArrivalDelayMinutes: null }),
  };

  it('names the UK regulator by default and uses GBP', () => {
    expect(bodyOf(ukInput, 'Enforcement body')).toContain('Civil Aviation Authority');
    expect(bodyOf(ukInput, 'Compensation (Article 7)')).toContain('GBP 520.00');
    expect(headings(ukInput)).toContain('Care while you wait (Article 9)');
  });
});

describe('ca-appr statement', () => {
  const caInput: StatementInput = {
    ...usInput,
    regime: 'ca-appr',
    compensation: compensationDue({ regime: 'ca-appr', deniedOn: '2025-03-01', plannedArrivalDelayMinutes: 420 }),
  };

  it('has the APPR amounts, 48 h payment, top-up and recourse to the Canadian Transportation Agency', () => {
    expect(bodyOf(caInput, 'Compensation amounts')).toContain('CAD 2,400.00');
    expect(bodyOf(caInput, 'Payment and top-up')).toContain('48 hours');
    expect(bodyOf(caInput, 'Payment and top-up')).toContain('tops up');
    expect(bodyOf(caInput, 'Recourse')).toContain('Canadian Transportation Agency');
    expect(headings(caInput).at(-1)).toBe(CAUTION_HEADING);
  });
});

describe('renderers', () => {
  const hostile: StatementInput = { ...usInput, carrierName: '<script>alert("x")</script>', passenger: { name: 'O\'Brien & <b>Sons</b>', pnr: 'ABC123' } };

  it('HTML escapes every input and renders lists', () => {
    const html = statementHtml(writtenStatement(hostile));
    expect(html).not.toContain('<script>');
    expect(html).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;');
    expect(html).toContain('O&#39;Brien &amp; &lt;b&gt;Sons&lt;/b&gt;');
    expect(html).toMatch(/<ul><li>1\. Check-in time/);
  });

  it('text has the subject, each heading underlined, and the caution last', () => {
    const text = statementText(writtenStatement(usInput));
    expect(text.startsWith('Denied boarding on Example Air flight XX100')).toBe(true);
    expect(text).toContain('Your options\n------------');
    expect(text.trimEnd().endsWith("the carrier's compliance staff decide what is owed.")).toBe(true);
  });

  it('refuses a compensation in the wrong currency for the regime', () => {
    expect(() => writtenStatement({ ...euInput, compensation: usInput.compensation })).toThrow(/^compensation\.currency:/);
  });
});
