// 14 CFR Part 250 as data: the next CPI revision is one more row in US_DBC_CAPS.

export interface UsCapRow {
  /** First denial date the caps apply to (the rule's effective date). */
  effectiveFrom: string;
  /** §250.5(a)(2) cap, also §250.5(b)(2): the 200% band. */
  domestic200CapMinor: number;
  /** §250.5(a)(3) cap, also §250.5(b)(3): the 400% band, twice the 200% cap. */
  domestic400CapMinor: number;
  source: string;
}

export const US_DBC_CAPS: readonly UsCapRow[] = [
  {
    effectiveFrom: '2011-08-23',
    domestic200CapMinor: 65_000,
    domestic400CapMinor: 130_000,
    // Effective day from memory; "in effect since August 2011" per 80 FR 30144.
    source: '76 FR 23110 (25 Apr 2011), effective 23 Aug 2011',
  },
  {
    effectiveFrom: '2015-08-01',
    domestic200CapMinor: 67_500,
    domestic400CapMinor: 135_000,
    // Amounts checked; effective day not verified ("in effect since August 2015", RIN 2105-AE61).
    source: '80 FR 30144 (27 May 2015), in effect from August 2015',
  },
  {
    effectiveFrom: '2021-04-13',
    domestic200CapMinor: 77_500,
    domestic400CapMinor: 155_000,
    source: '86 FR 2534 (13 Jan 2021), effective 13 Apr 2021',
  },
  {
    effectiveFrom: '2025-01-22',
    domestic200CapMinor: 107_500,
    domestic400CapMinor: 215_000,
    source: '89 FR 84815 (24 Oct 2024), effective 22 Jan 2025',
  },
];

/**
 * Planned-arrival thresholds of §250.5(a) (domestic) and §250.5(b) (foreign air transportation from
 * a US airport), in minutes: up to noneUpTo nothing is due; below fourHundredFrom 200%; from it, 400%.
 */
export const US_DELAY_BANDS = {
  domestic: { noneUpTo: 60, fourHundredFrom: 120, ruleRef: '14 CFR 250.5(a)' },
  international: { noneUpTo: 60, fourHundredFrom: 240, ruleRef: '14 CFR 250.5(b)' },
} as const;

/** §250.2: Part 250 covers flights using aircraft designed for 30 or more passenger seats. */
export const US_MIN_SEATS_IN_SCOPE = 30;

/** §250.6(b): the weight/balance exception is limited to aircraft of 60 seats or fewer. */
export const US_WEIGHT_BALANCE_MAX_SEATS = 60;

/** CPI-U of August 2011, the base of the §250.5(e) formula (from memory; reproduces every published cap). */
export const CPI_U_AUGUST_2011 = 226.545;

/** July CPI-U values used by the published revisions (from memory; each reproduces its rule's cap). */
export const CPI_U_JULY: Readonly<Record<number, number>> = {
  2014: 238.25,
  2020: 259.101,
  2024: 314.54,
};

export interface RevisedCaps {
  domestic200CapMinor: number;
  domestic400CapMinor: number;
}

/**
 * §250.5(e): new 200% cap = current cap x (July CPI-U of the review year / August 2011 CPI-U), rounded
 * to the nearest $25; the 400% cap is twice the new 200% cap (not its own rounding). The formula
 * multiplies the CURRENT cap, as 89 FR 84815 sets it out, so revisions compound from the 2011 base.
 */
export function reviseUsCaps(currentDomestic200CapMinor: number, julyCpiU: number): RevisedCaps {
  if (!Number.isSafeInteger(currentDomestic200CapMinor) || currentDomestic200CapMinor <= 0) {
    throw new RangeError(`currentDomestic200CapMinor: expected a positive integer of cents, got ${currentDomestic200CapMinor}`);
  }
  if (!Number.isFinite(julyCpiU) || julyCpiU <= 0) {
    throw new RangeError(`julyCpiU: expected a positive CPI-U index value, got ${julyCpiU}`);
  }
  const unroundedDollars = (currentDomestic200CapMinor / 100) * (julyCpiU / CPI_U_AUGUST_2011);
  const roundedDollars = Math.round(unroundedDollars / 25) * 25;
  return { domestic200CapMinor: roundedDollars * 100, domestic400CapMinor: roundedDollars * 200 };
}
