import { describe, expect, it } from 'vitest';
import { CPI_U_JULY, US_DBC_CAPS, reviseUsCaps } from './us-dot-rules';

describe('§250.5(e) CPI-U cap revision', () => {
  // Formula as set out in 89 FR 84815: current cap x (July CPI-U / August 2011 CPI-U), nearest $25;
  // the 400% cap is twice the revised 200% cap. CPI values are from memory.
  it('2011 cap $650 with July 2014 CPI-U -> $675 / $1,350 (80 FR 30144)', () => {
    expect(reviseUsCaps(65_000, CPI_U_JULY[2014])).toEqual({ domestic200CapMinor: 67_500, domestic400CapMinor: 135_000 });
  });

  it('cap $675 with July 2020 CPI-U -> $775 / $1,550 (86 FR 2534)', () => {
    expect(reviseUsCaps(67_500, CPI_U_JULY[2020])).toEqual({ domestic200CapMinor: 77_500, domestic400CapMinor: 155_000 });
  });

  it('cap $775 with July 2024 CPI-U -> $1,075 / $2,150 (89 FR 84815)', () => {
    expect(reviseUsCaps(77_500, CPI_U_JULY[2024])).toEqual({ domestic200CapMinor: 107_500, domestic400CapMinor: 215_000 });
  });

  it('chaining the revisions from the 2011 base reproduces every row of the table', () => {
    const years = [2014, 2020, 2024];
    let cap = US_DBC_CAPS[0].domestic200CapMinor;
    years.forEach((year, index) => {
      const revised = reviseUsCaps(cap, CPI_U_JULY[year]);
      expect(revised.domestic200CapMinor).toBe(US_DBC_CAPS[index + 1].domestic200CapMinor);
      expect(revised.domestic400CapMinor).toBe(US_DBC_CAPS[index + 1].domestic400CapMinor);
      cap = revised.domestic200CapMinor;
    });
  });

  it('rounds to the nearest $25 (derived: $1,000 x 1.0126 = $1,012.60 -> $1,025; x 1.0124 = $1,012.40 -> $1,000)', () => {
    const august2011 = 226.545;
    expect(reviseUsCaps(100_000, august2011 * 1.0126).domestic200CapMinor).toBe(102_500);
    expect(reviseUsCaps(100_000, august2011 * 1.0124).domestic200CapMinor).toBe(100_000);
  });

  it('refuses a cap that is not whole cents and a CPI that is not positive', () => {
    expect(() => reviseUsCaps(650.5, 300)).toThrow(/currentDomestic200CapMinor/);
    expect(() => reviseUsCaps(65_000, 0)).toThrow(/julyCpiU/);
  });

  it('table rows are sorted oldest first and the 400% cap is twice the 200% cap', () => {
    for (let index = 0; index < US_DBC_CAPS.length; index += 1) {
      const row = US_DBC_CAPS[index];
      expect(row.domestic400CapMinor).toBe(row.domestic200CapMinor * 2);
      if (index > 0) expect(row.effectiveFrom > US_DBC_CAPS[index - 1].effectiveFrom).toBe(true);
    }
  });
});
