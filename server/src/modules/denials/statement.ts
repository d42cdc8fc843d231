// The written statement each denied passenger receives: built from the frozen compensation, mailed and printable.
import { accessibleStatementPage, statementHtml, statementText, writtenStatement, type WrittenStatement } from '@shared/compensation/statement';
import { translator, type Language } from '@shared/i18n';
import type { PriorityRule } from '@shared/denial';
import type { PassengerCompensation } from '@shared/schemas/denials';
import type { RegimeCode } from '@shared/schemas/common';
import type { FlightEntity, PassengerEntity, RebookingEntity, StationEntity } from '../../db/entities';
import { escapeHtml } from '../../notices';
import type { ChoiceAndCare } from '../care/for-statement';
import { findAirport } from '../../reference/airports';
import { asCompensationResult } from './compensation';
import { enforcementBodyFor } from './enforcement-bodies';

// The operating carrier named in every statement: one carrier per installation, set once from configuration when
// the app is created (createApp), so the statement services need no extra wiring through every caller.
let carrierName: string | null = null;

export function configureCarrierName(name: string): void {
  carrierName = name;
}

function configuredCarrierName(): string {
  if (carrierName === null) throw new Error('Configuration error: CARRIER_NAME: the operating carrier named in written statements is not set');
  return carrierName;
}

export interface StatementFacts {
  station: StationEntity;
  flight: FlightEntity;
  pnr: string;
  passenger: PassengerEntity;
  compensation: PassengerCompensation;
  rebooking: RebookingEntity | null;
  rules: PriorityRule[];
  /** The booking's language; English when the booking has none. */
  language?: Language | null;
  /** The passenger's choice and the care given so far, in the same language; absent before the desk recorded any. */
  choiceAndCare?: ChoiceAndCare;
}

const arrivalZone = (iata: string, fallback: string) => findAirport(iata)?.tz ?? fallback;

export function statementFor(facts: StatementFacts): WrittenStatement {
  const { station, flight, rebooking } = facts;
  const zone = arrivalZone(flight.destination, station.timeZone);
  const regime = station.regime as RegimeCode;
  const tr = translator(facts.language ?? 'en');
  return writtenStatement({
    language: tr.language,
    regime,
    carrierName: configuredCarrierName(),
    station: `${station.name} (${station.iata})`,
    passenger: { name: `${facts.passenger.firstName} ${facts.passenger.lastName}`, pnr: facts.pnr },
    flight: {
      number: `${flight.carrierCode} ${flight.flightNumber}`,
      date: flight.serviceDate,
      origin: flight.origin,
      destination: flight.destination,
      scheduledArrival: tr.dateTime('flight.scheduledArrival', flight.scheduledArrival, zone),
    },
    alternate: rebooking
      ? { flightNumber: rebooking.label, plannedArrival: tr.dateTime('alternate.arrival', rebooking.arrival, zone), destination: flight.destination }
      : null,
    compensation: asCompensationResult(facts.compensation),
    priorityRules: facts.rules,
    enforcementBody: enforcementBodyFor(regime, flight.origin).body,
    choice: facts.choiceAndCare?.choice ?? null,
    care: facts.choiceAndCare?.care ?? [],
  });
}

const PRINT_CSS = `
  body { font-family: Georgia, 'Times New Roman', serif; color: #111; max-width: 46rem; margin: 2rem auto; padding: 0 1rem; line-height: 1.45; }
  h1 { font-size: 1.4rem; margin: 0 0 1rem; }
  h2 { font-size: 1.1rem; margin: 1.4rem 0 0.4rem; border-bottom: 1px solid #999; }
  article + article { margin-top: 3rem; }
  .screen-only { background: #eef3f5; border: 1px solid #9bb; padding: 0.5rem 0.8rem; font-family: sans-serif; font-size: 0.9rem; }
  @media print {
    body { margin: 0; max-width: none; font-size: 11pt; }
    .screen-only { display: none; }
    article { break-after: page; }
    article:last-of-type { break-after: auto; }
    h2 { break-after: avoid; }
  }
`;

/** A whole HTML page with print styles: one statement per passenger, each starting on a new sheet. */
export function statementPage(title: string, statements: WrittenStatement[], screenNote?: string): string {
  const note = screenNote ? `<p class="screen-only">${escapeHtml(screenNote)}</p>` : '';
  return `<!doctype html>\n<html lang="${statements[0]?.language ?? 'en'}"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title><style>${PRINT_CSS}</style></head>\n<body>${note}${statements.map(statementHtml).join('\n')}</body></html>\n`;
}

/** The mail's HTML is the accessible page (Reg. 261/2004 Art. 14(3)): headings, contents, no layout tables. */
export function statementMail(statement: WrittenStatement): { subject: string; text: string; html: string } {
  return { subject: statement.subject, text: statementText(statement), html: accessibleStatementPage(statement) };
}
