// The minor-unit exponents of ISO 4217 list one that are not 2. The runtime's currency data (Intl, from CLDR) is
// what the product reads amounts with; this list is the independent standard it is held against, so a currency on
// which the two disagree is refused rather than read one way in one place and another way elsewhere.
// Values from memory of ISO 4217 list one (SIX Financial Information, "Current currency & funds"); every other
// active code has 2.
export const ISO_4217_EXPONENT_NOT_TWO: Readonly<Record<string, number>> = {
  BIF: 0, CLP: 0, DJF: 0, GNF: 0, ISK: 0, JPY: 0, KMF: 0, KRW: 0, PYG: 0, RWF: 0, UGX: 0, UYI: 0, VND: 0,
  VUV: 0, XAF: 0, XOF: 0, XPF: 0,
  BHD: 3, IQD: 3, JOD: 3, KWD: 3, LYD: 3, OMR: 3, TND: 3,
  CLF: 4, UYW: 4,
};

/** ISO 4217's minor-unit exponent for an active code (2 unless listed above). */
export function isoExponent(currency: string): number {
  return ISO_4217_EXPONENT_NOT_TWO[currency] ?? 2;
}
