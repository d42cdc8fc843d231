// Where a passenger denied boarding can complain: the body named in the written statement.
// Reg. (EC) 261/2004 Art. 16(1): each Member State designates the body for flights from airports on its territory,
// so the departure airport's country decides. Every name and address below is from memory and is flagged for
// review on the bump review screen until compliance staff confirm it.
import type { EnforcementBody } from '@shared/compensation/statement';
import type { RegimeCode } from '@shared/schemas/common';
import { findAirport } from '../../reference/airports';

/** National enforcement bodies by the OpenFlights country of the departure airport (all from memory). */
const EU_BODIES: Readonly<Record<string, EnforcementBody>> = {
  Italy: { name: 'ENAC – Ente Nazionale per l’Aviazione Civile (Italian Civil Aviation Authority)', website: 'www.enac.gov.it' },
  Germany: { name: 'Luftfahrt-Bundesamt (LBA), passenger rights', website: 'www.lba.de' },
  Belgium: { name: 'Federal Public Service Mobility and Transport, Passenger Rights Service', website: 'mobilit.belgium.be' },
  Portugal: { name: 'ANAC – Autoridade Nacional da Aviação Civil', website: 'www.anac.pt' },
  Spain: { name: 'AESA – Agencia Estatal de Seguridad Aérea', website: 'www.seguridadaerea.gob.es' },
  Netherlands: { name: 'Inspectie Leefomgeving en Transport (ILT)', website: 'www.ilent.nl' },
  Ireland: { name: 'Commission for Aviation Regulation', website: 'www.aviationreg.ie' },
  Austria: { name: 'apf – Agentur für Passagier- und Fahrgastrechte', website: 'www.apf.gv.at' },
};

/** 14 CFR 250.9 does not require it, but naming the regulator helps the passenger (from memory). */
const US_BODY: EnforcementBody = { name: 'U.S. Department of Transportation, Office of Aviation Consumer Protection', website: 'www.transportation.gov/airconsumer' };

export interface EnforcementChoice {
  /** undefined: the statement module's own default for the regime (UK CAA, Canadian Transportation Agency). */
  body: EnforcementBody | undefined;
  reviewFlag: string;
}

export function enforcementBodyFor(regime: RegimeCode, originIata: string): EnforcementChoice {
  if (regime === 'us-dot') return { body: US_BODY, reviewFlag: `Complaints contact (${US_BODY.name}, ${US_BODY.website}) is built in: confirm it with the regulator before relying on the statement.` };
  if (regime === 'uk-261' || regime === 'ca-appr') {
    return { body: undefined, reviewFlag: 'Enforcement body named in the statement is the built-in default: confirm its contact details with the regulator.' };
  }
  const country = findAirport(originIata)?.country ?? 'unknown country';
  const known = EU_BODIES[country];
  if (known) {
    return { body: known, reviewFlag: `Enforcement body for ${country} (${known.name}, ${known.website}) is built in: confirm its contact details with the regulator before relying on the statement.` };
  }
  return {
    body: { name: `The national enforcement body for air passenger rights in ${country}`, website: 'europa.eu (Your Europe: air passenger rights, national enforcement bodies)' },
    reviewFlag: `No enforcement body is configured for ${country}: the statement names it only generally. Add the body's contact details before handing it out.`,
  };
}
