import { describe, expect, it } from 'vitest';
import { volunteerDisclosure } from './disclosure';

const policy = { currency: 'USD', ladderMinor: [20_000], agentLimitMinor: 60_000, supervisorLimitMinor: null, raisePolicy: 'lift-to-new-offer' as const, sealedBidPricing: 'own-ask' as const, extras: [], voucherRestrictions: [] };

describe('what a volunteer is told they would be owed if bumped', () => {
  it('states the US caps in force on the day of the offer, from the rules table', () => {
    // 14 CFR 250.5 caps: $1,075 / $2,150 from 22 Jan 2025 (89 FR 84815); $775 / $1,550 before (86 FR 2534).
    const now = volunteerDisclosure('us-dot', policy, 0.2, '2025-02-01').involuntaryRule;
    expect(now).toContain('at most USD 1,075.00');
    expect(now).toContain('at most USD 2,150.00');
    const before = volunteerDisclosure('us-dot', policy, 0.2, '2024-12-01').involuntaryRule;
    expect(before).toContain('at most USD 775.00');
    expect(before).toContain('at most USD 1,550.00');
  });

  it('states the EU, UK and Canadian amounts from their tables', () => {
    // Reg. (EC) 261/2004 Art. 7(1): EUR 250 / 400 / 600; SOR/2019-150 s. 20(1): CAD 900 / 1,800 / 2,400.
    expect(volunteerDisclosure('eu-261', policy, 0.2, '2025-02-01').involuntaryRule).toContain('EUR 250.00, EUR 400.00 or EUR 600.00');
    expect(volunteerDisclosure('ca-appr', policy, 0.2, '2025-02-01').involuntaryRule).toContain('CAD 900.00 when you arrive less than 6 hours late, CAD 1,800.00');
  });

  it('tells an EU volunteer the right they keep under Art. 4(1): Art. 8 assistance, not Art. 9 care', () => {
    // Reg. (EC) 261/2004 Art. 4(1): volunteers "shall be assisted in accordance with Article 8".
    const text = volunteerDisclosure('eu-261', policy, 0.2, '2025-02-01').involuntaryRule;
    expect(text).toContain('As a volunteer you also keep the right to a refund or rerouting (EU Regulation 261/2004 Art. 4(1) and 8).');
  });
});
