// Required content: 14 CFR 250.9(b), the prescribed text (first paragraphs checked against the published rule); Reg. 261/2004 Art. 14(2) (Art. 7, 8, 9 and
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
// Amounts keep their code and number together with a no-break space (Intl); the checks read it as a space.
const bodyOf = (input: StatementInput, heading: string) => (writtenStatement(input).sections.find((section) => section.heading === heading)?.body ?? '').replace(/\u00a0/g, ' ');

describe('us-dot statement: the text 14 CFR 250.9(b) prescribes', () => {
  it('gives the prescribed sections first, then the passenger\'s case, and ends with the caution', () => {
    expect(headings(usInput)).toEqual([
      'Compensation for Denied Boarding',
      'Volunteers and Boarding Priorities',
      'Compensation for Involuntary Denied Boarding',
      'Amount of Denied Boarding Compensation',
      'Method of Payment',
      "Passenger's Options",
      'Your case',
      'Your compensation',
      'Alternate transportation',
      'Other formats',
      CAUTION_HEADING,
    ]);
  });

  it('reads as the rule prescribes, with the carrier named where the rule says "(name of air carrier)"', () => {
    // 14 CFR 250.9(b), first paragraph, as published (laws9.com/cfr/text/14/250/9; law.lawstack.com/cfr/14/250.9).
    expect(bodyOf(usInput, 'Compensation for Denied Boarding')).toBe(
      "If you have been denied a reserved seat on Example Air, you are probably entitled to monetary compensation. This notice explains the airline's obligation and the passenger's rights in the case of an oversold flight, in accordance with regulations of the U.S. Department of Transportation.",
    );
    // Second paragraph, same source, up to the space the carrier fills with its boarding priority rules.
    expect(bodyOf(usInput, 'Volunteers and Boarding Priorities')).toMatch(
      /^If a flight is oversold \(more passengers hold confirmed reservations than there are seats available\), no one may be denied boarding against his or her will until airline personnel first ask for volunteers who will give up their reservation willingly, in exchange for a payment of the airline's choosing\. If there are not enough volunteers, other passengers may be denied boarding involuntarily in accordance with the following boarding priority of Example Air:\n/,
    );
    expect(bodyOf(usInput, "Passenger's Options")).toContain('Acceptance of the compensation may relieve Example Air from any further liability');
  });

  it('inserts the carrier\'s boarding priority rules in the space the rule leaves for them', () => {
    const body = bodyOf(usInput, 'Volunteers and Boarding Priorities');
    expect(body).toContain('- 1. Check-in time');
    expect(body).toContain('- 2. Fare paid');
  });

  it('states the caps in force (89 FR 84815: $1,075 / $2,150) from the rules table, and the passenger amount', () => {
    const body = bodyOf(usInput, 'Amount of Denied Boarding Compensation');
    expect(body).toContain('with a maximum of $1,075,');
    expect(body).toContain('with a maximum of $2,150,');
    expect(body).toContain('less than four hours');
    // 86 FR 2534: $775 / $1,550 for a denial before 22 Jan 2025.
    const earlier = { ...usInput, compensation: compensationDue({ regime: 'us-dot', deniedOn: '2024-06-01', oneWayFare: { amountMinor: 30_000, currency: 'USD' }, plannedArrivalDelayMinutes: 180, aircraftSeats: 150 }) };
    expect(bodyOf(earlier, 'Amount of Denied Boarding Compensation')).toContain('with a maximum of $1,550,');
    expect(bodyOf(usInput, 'Your compensation')).toContain('Your compensation: USD 1,200.00');
  });

  it('lists the exceptions, cash or check, and the options', () => {
    expect(bodyOf(usInput, 'Compensation for Involuntary Denied Boarding')).toContain('60 or fewer seats');
    expect(bodyOf(usInput, 'Method of Payment')).toContain('a payment by cash or check');
    expect(bodyOf(usInput, "Passenger's Options")).toContain('court of law');
  });

  it('a voucher must be worth at least the cash amount (§250.5(c)), and the cash amount is stated', () => {
    expect(() => writtenStatement({ ...usInput, voucherOffer: { valueMinor: 100_000, currency: 'USD' } })).toThrow(/^voucherOffer\.valueMinor:/);
    const body = bodyOf({ ...usInput, voucherOffer: { valueMinor: 150_000, currency: 'USD', restrictions: 'valid 1 year' } }, 'Your compensation');
    expect(body).toContain('USD 1,500.00');
    expect(body).toContain('You may refuse it and receive USD 1,200.00');
  });
});

describe('no provenance notes in what passengers read', () => {
  it('no statement of any regime says "from memory", "not verified" or "secondary sources"', () => {
    for (const input of [usInput, euInput]) {
      expect(statementText(writtenStatement(input))).not.toMatch(/from memory|not verified|secondary sources|\(derived\)/i);
    }
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
    expect(text).toContain("Passenger's Options\n-------------------");
    expect(text.trimEnd().endsWith("the carrier's compliance staff decide what is owed.")).toBe(true);
  });

  it('refuses a compensation in the wrong currency for the regime', () => {
    expect(() => writtenStatement({ ...euInput, compensation: usInput.compensation })).toThrow(/^compensation\.currency:/);
  });
});
