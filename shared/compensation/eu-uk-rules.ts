// Art. 7 of Regulation (EC) 261/2004 and its retained UK version, as data.

export type EuStyleRegime = 'eu-261' | 'uk-261';
export type DistanceBand = 'a' | 'b' | 'c';

export interface EuStyleAmountRow {
  effectiveFrom: string;
  currency: string;
  /** Art. 7(1)(a): flights of 1,500 km or less. */
  bandAMinor: number;
  /** Art. 7(1)(b): intra-Community flights over 1,500 km and all other flights between 1,500 and 3,500 km. */
  bandBMinor: number;
  /** Art. 7(1)(c): all other flights. */
  bandCMinor: number;
  source: string;
}

export const EU_STYLE_AMOUNTS: Readonly<Record<EuStyleRegime, readonly EuStyleAmountRow[]>> = {
  'eu-261': [
    {
      effectiveFrom: '2005-02-17',
      currency: 'EUR',
      bandAMinor: 25_000,
      bandBMinor: 40_000,
      bandCMinor: 60_000,
      // In-force date (Art. 19) from memory.
      source: 'Reg. (EC) 261/2004 Art. 7(1); in force from 17 Feb 2005 (Art. 19)',
    },
  ],
  'uk-261': [
    {
      // The UK version applies to denials from the end of the EU exit transition period.
      effectiveFrom: '2021-01-01',
      currency: 'GBP',
      bandAMinor: 22_000,
      bandBMinor: 35_000,
      bandCMinor: 52_000,
      // Amounts seen only in secondary sources; start date from memory.
      source: 'Retained Reg. 261/2004 Art. 7(1) as amended by SI 2019/278',
    },
  ],
};

export const BAND_A_MAX_KM = 1500;
export const BAND_B_MAX_KM = 3500;

/**
 * Policy for a non-intra-Community flight of exactly 3,500 km: Art. 7(1)(b) reads "between 1500 and
 * 3500 kilometres", read here as inclusive, so 3,500 km falls in band b (the EUR 400 / GBP 350 band).
 */
export const EXACTLY_3500_KM_POLICY = '3,500 km inclusive falls in band b, reading Art. 7(1)(b) "between 1500 and 3500 kilometres" as inclusive';

/** Art. 7(2): the rerouting may arrive this many minutes after the scheduled arrival and still be halvable. */
export const REDUCTION_MAX_DELAY_MINUTES: Readonly<Record<DistanceBand, number>> = { a: 120, b: 180, c: 240 };

/** Distance to check by hand: this close to a band edge, coordinate choice can move the band. */
export const BAND_EDGE_REVIEW_KM = 5;

export function distanceBand(distanceKm: number, intraCommunity: boolean): DistanceBand {
  if (distanceKm <= BAND_A_MAX_KM) return 'a';
  if (intraCommunity) return 'b';
  return distanceKm <= BAND_B_MAX_KM ? 'b' : 'c';
}

export function bandAmountMinor(row: EuStyleAmountRow, band: DistanceBand): number {
  if (band === 'a') return row.bandAMinor;
  return band === 'b' ? row.bandBMinor : row.bandCMinor;
}
