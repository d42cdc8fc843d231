// What people read in place of the codes the engine and the database use: one module for every screen and mail.
// Amounts in a band's words come from the same rules tables the computation reads, never typed into the text.
import { APPR_DENIED_BOARDING_AMOUNTS } from './ca-appr';
import { EU_STYLE_AMOUNTS, type EuStyleRegime } from './eu-uk-rules';
import { formatMoney } from './money';
import { REGIMES, type Regime } from './types';
import { US_DBC_CAPS } from './us-dot-rules';
import { rowInForce } from './validation';

export const REGIME_NAMES: Readonly<Record<Regime, string>> = {
  'us-dot': 'US rule 14 CFR Part 250',
  'eu-261': 'EU Regulation 261/2004',
  'uk-261': 'UK Regulation 261/2004 (as retained)',
  'ca-appr': 'Canada’s Air Passenger Protection Regulations',
};

/** "EU Regulation 261/2004" for "eu-261"; an unknown code is shown as it is, so nothing is hidden. */
export function regimeLabel(code: string): string {
  return (REGIMES as readonly string[]).includes(code) ? REGIME_NAMES[code as Regime] : code;
}

const today = () => new Date().toISOString().slice(0, 10);

/** The rules row in force on the day (or the first row, for a day before the table starts). */
function inForce<Row extends { effectiveFrom: string }>(rows: readonly Row[], on: string, what: string): Row {
  return on < rows[0].effectiveFrom ? rows[0] : rowInForce(rows, on, what);
}

const EU_DISTANCE_WORDS: Record<'a' | 'b' | 'c', string> = {
  a: 'flights of 1,500 km or less',
  b: 'flights of 1,500 to 3,500 km, or over 1,500 km within the EU',
  c: 'longer flights',
};

/**
 * "400 % of the fare, up to USD 2,150.00" for "us-400pct", "EUR 250.00 for flights of 1,500 km or less" for "eu-a",
 * with the amounts of the rules in force on `on` (an ISO date; today by default).
 */
export function bandLabel(band: string, on: string = today()): string {
  const us = inForce(US_DBC_CAPS, on, 'us-dot');
  const usd = (minor: number) => formatMoney(minor, 'USD');
  switch (band) {
    case 'us-200pct': return `200 % of the fare, up to ${usd(us.domestic200CapMinor)}`;
    case 'us-400pct': return `400 % of the fare, up to ${usd(us.domestic400CapMinor)}`;
    case 'us-none-within-1h': return 'No compensation: the alternate arrives within 1 hour';
    case 'exempt': return 'No compensation: an exception of the rules applies';
    case 'out-of-scope': return 'Outside these rules';
    case 'volunteer': return 'Volunteer: the amount agreed with the passenger';
    // Stored by the volunteer rounds and by a denial whose rules could not be applied.
    case 'posted offer': return 'Volunteer: the posted offer, accepted';
    case 'sealed bid': return 'Volunteer: their sealed bid, accepted';
    case 'not-computed': return 'Not computed: the rules could not be applied, check the case';
  }
  const eu = /^(eu|uk)-([abc])$/.exec(band);
  if (eu) {
    const regime: EuStyleRegime = eu[1] === 'eu' ? 'eu-261' : 'uk-261';
    const row = inForce(EU_STYLE_AMOUNTS[regime], on, regime);
    const letter = eu[2] as 'a' | 'b' | 'c';
    const amount = letter === 'a' ? row.bandAMinor : letter === 'b' ? row.bandBMinor : row.bandCMinor;
    return `${formatMoney(amount, row.currency)} for ${EU_DISTANCE_WORDS[letter]}`;
  }
  const ca = inForce(APPR_DENIED_BOARDING_AMOUNTS, on, 'ca-appr');
  const cad = (minor: number) => formatMoney(minor, ca.currency);
  if (band === 'ca-under-6h') return `${cad(ca.under6hMinor)} for an arrival less than 6 hours late`;
  if (band === 'ca-6h-to-9h') return `${cad(ca.from6hUnder9hMinor)} for an arrival 6 to 9 hours late`;
  if (band === 'ca-9h-or-more') return `${cad(ca.atLeast9hMinor)} for an arrival 9 hours or more late`;
  return 'Compensation band not recognised: check the case';
}
