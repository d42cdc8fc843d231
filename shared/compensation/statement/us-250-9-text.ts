// The written statement 14 CFR 250.9(b) prescribes ("The statement shall read as follows"), with the carrier's name,
// its boarding priority rules and the caps of §250.5 in force inserted where the rule asks. The first two
// paragraphs are checked against the published text of §250.9(b); the later paragraphs are from memory of the
// rule as amended in 2011 and must be checked against eCFR before a carrier relies on them.
import type { StatementSection } from './types';

export interface PrescribedTextInput {
  carrierName: string;
  /** The carrier's boarding priority rules, one line each, in words an average passenger understands. */
  priorityLines: string[];
  /** §250.5 caps in force on the day of the denial, already formatted ("$1,075"). */
  cap200: string;
  cap400: string;
}

const bands = (scope: string, lateLimit: string, cap200: string, cap400: string) =>
  [
    `${scope} (1) No compensation if the carrier offers alternate transportation that is planned to arrive at the passenger's destination or first stopover not later than one hour after the planned arrival time of the passenger's original flight;`,
    `(2) 200% of the fare to the passenger's destination or first stopover, with a maximum of ${cap200}, if the carrier offers alternate transportation that is planned to arrive at the passenger's destination or first stopover more than one hour but less than ${lateLimit} after the planned arrival time of the passenger's original flight; and`,
    `(3) 400% of the fare to the passenger's destination or first stopover, with a maximum of ${cap400}, if the carrier does not offer alternate transportation that is planned to arrive at the airport of the passenger's destination or first stopover less than ${lateLimit} after the planned arrival time of the passenger's original flight.`,
  ].join('\n');

export function prescribedSections({ carrierName, priorityLines, cap200, cap400 }: PrescribedTextInput): StatementSection[] {
  return [
    {
      id: 'us-250-9',
      heading: 'Compensation for Denied Boarding',
      body: `If you have been denied a reserved seat on ${carrierName}, you are probably entitled to monetary compensation. This notice explains the airline's obligation and the passenger's rights in the case of an oversold flight, in accordance with regulations of the U.S. Department of Transportation.`,
    },
    {
      id: 'us-250-9',
      heading: 'Volunteers and Boarding Priorities',
      body: [
        `If a flight is oversold (more passengers hold confirmed reservations than there are seats available), no one may be denied boarding against his or her will until airline personnel first ask for volunteers who will give up their reservation willingly, in exchange for a payment of the airline's choosing. If there are not enough volunteers, other passengers may be denied boarding involuntarily in accordance with the following boarding priority of ${carrierName}:`,
        ...priorityLines,
      ].join('\n'),
    },
    {
      id: 'us-250-9',
      heading: 'Compensation for Involuntary Denied Boarding',
      body: "If you are denied boarding involuntarily, you are entitled to a payment of \"denied boarding compensation\" from the airline unless: (1) you have not fully complied with the airline's ticketing, check-in and reconfirmation requirements, or you are not acceptable for transportation under the airline's usual rules and practices; or (2) you are denied boarding because the flight is canceled; or (3) you are denied boarding because a smaller capacity aircraft was substituted for safety or operational reasons; or (4) on a flight operated with an aircraft having 60 or fewer seats, you are denied boarding due to safety-related aircraft weight or balance constraints; or (5) you are offered accommodations in a section of the aircraft other than specified in your ticket, at no extra charge (a passenger seated in a section for which a lower fare is charged must be given an appropriate refund); or (6) the airline is able to place you on another flight or flights that are planned to reach your next stopover or final destination within one hour of the planned arrival time of your original flight.",
    },
    {
      id: 'us-250-9',
      heading: 'Amount of Denied Boarding Compensation',
      body: [
        bands('Passengers traveling between points within the United States (including the territories and possessions) who are denied boarding involuntarily from an oversold flight are entitled to:', 'two hours', cap200, cap400),
        bands('Passengers traveling from the United States to a foreign point who are denied boarding involuntarily from an oversold flight originating at a U.S. airport are entitled to:', 'four hours', cap200, cap400),
      ].join('\n'),
    },
    {
      id: 'us-250-9',
      heading: 'Method of Payment',
      body: 'The airline must give each passenger who qualifies for involuntary denied boarding compensation a payment by cash or check for the amount specified above, on the day and at the place the involuntary denied boarding occurs. If the airline arranges alternate transportation for the passenger\'s convenience that departs before the payment can be made, the payment shall be sent to the passenger within 24 hours. The air carrier may offer free or discounted transportation in place of the cash payment. In that event, the carrier must disclose all material restrictions on the use of the free or discounted transportation before the passenger decides whether to accept the transportation in lieu of a cash or check payment. The passenger may insist on the cash/check payment or refuse all compensation and bring private legal action.',
    },
    {
      id: 'us-250-9',
      heading: "Passenger's Options",
      body: `Acceptance of the compensation may relieve ${carrierName} from any further liability to the passenger caused by its failure to honor the confirmed reservation. However, the passenger may decline the payment and seek to recover damages in a court of law or in some other manner.`,
    },
  ];
}
