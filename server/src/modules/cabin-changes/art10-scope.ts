// Which clause of Art. 10(2) of Reg. (EC) 261/2004 a downgraded flight falls under. Art. 10 does not reuse Art. 7's
// reading of "intra-Community": its point (b) excepts flights between the European territory of the Member States and
// the French overseas departments, and point (c) names them, so they are reimbursed at 75 % whatever their length
// (Art. 10(2)(b)-(c), official text).
import { findAirport, isEuAirport } from '../../reference/airports';

/** The French overseas departments, as the airport data names their countries. */
export const FRENCH_OVERSEAS_DEPARTMENTS: ReadonlySet<string> = new Set(['Reunion', 'Mayotte', 'Martinique', 'Guadeloupe', 'French Guiana']);

const overseasDepartment = (iata: string) => FRENCH_OVERSEAS_DEPARTMENTS.has(findAirport(iata)?.country ?? '');

/** True when the flight counts as intra-Community for Art. 10(2)(b); a European-territory ↔ overseas-department flight does not. */
export function art10IntraCommunity(origin: string, destination: string): boolean {
  if (!isEuAirport(origin) || !isEuAirport(destination)) return false;
  return overseasDepartment(origin) === overseasDepartment(destination);
}
