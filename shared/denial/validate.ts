// Checks the passenger list and context once, so ranking code can trust its input.
import { assertCurrency, assertMinorAmount } from '../compensation/money';
import { parseIsoDateTime } from '../compensation/validation';
import type { DenialContext, DenialPassenger } from './types';

export interface CheckedPassenger extends DenialPassenger {
  checkedInMs: number | null;
  boardedMs: number | null;
  ssr: Set<string>;
}

export interface CheckedContext {
  tierRank: Map<string, number>;
  tierOrder: string[];
  currency: string;
  timeZone: string;
  childAgeUnder: number;
  checkInDeadlineMs: number | null;
  nowMs: number | null;
  context: DenialContext;
}

export function checkContext(context: DenialContext): CheckedContext {
  if (typeof context !== 'object' || context === null) throw new RangeError('context: expected an object');
  if (!Array.isArray(context.tierOrder) || context.tierOrder.some((tier) => typeof tier !== 'string' || tier === '')) {
    throw new RangeError('context.tierOrder: expected tier names from lowest to highest status');
  }
  if (new Set(context.tierOrder).size !== context.tierOrder.length) {
    throw new RangeError('context.tierOrder: a tier is listed twice');
  }
  assertCurrency('context.currency', context.currency);
  const timeZone = context.stationTimeZone ?? 'UTC';
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone });
  } catch {
    throw new RangeError(`context.stationTimeZone: ${JSON.stringify(timeZone)} is not an IANA time zone`);
  }
  const childAgeUnder = context.childAgeUnder ?? 12;
  if (!Number.isInteger(childAgeUnder) || childAgeUnder < 1 || childAgeUnder > 18) {
    throw new RangeError(`context.childAgeUnder: expected a whole age from 1 to 18, got ${childAgeUnder}`);
  }
  const tierRank = new Map(context.tierOrder.map((tier, index) => [tier, index + 1]));
  const checkInDeadlineMs = context.checkInDeadline === undefined ? null : parseIsoDateTime('context.checkInDeadline', context.checkInDeadline);
  const nowMs = context.now === undefined ? null : parseIsoDateTime('context.now', context.now);
  return { tierRank, tierOrder: context.tierOrder, currency: context.currency, timeZone, childAgeUnder, checkInDeadlineMs, nowMs, context };
}

export function checkPassengers(passengers: DenialPassenger[], context: CheckedContext, needsSeatFlag: boolean): CheckedPassenger[] {
  if (!Array.isArray(passengers)) throw new RangeError('passengers: expected an array');
  const ids = new Set<string>();
  return passengers.map((passenger, index) => {
    const field = (name: string) => `passengers[${index}].${name}`;
    if (typeof passenger !== 'object' || passenger === null) throw new RangeError(`passengers[${index}]: expected an object`);
    for (const name of ['id', 'pnr', 'partyId', 'name'] as const) {
      if (typeof passenger[name] !== 'string' || passenger[name] === '') throw new RangeError(`${field(name)}: expected a non-empty string`);
    }
    if (passenger.familyName !== undefined && typeof passenger.familyName !== 'string') throw new RangeError(`${field('familyName')}: expected a string`);
    if (ids.has(passenger.id)) throw new RangeError(`${field('id')}: ${passenger.id} appears twice`);
    ids.add(passenger.id);
    assertMinorAmount(field('fareMinor'), passenger.fareMinor);
    if (passenger.frequentFlyerTier !== null && !context.tierRank.has(passenger.frequentFlyerTier)) {
      throw new RangeError(`${field('frequentFlyerTier')}: ${JSON.stringify(passenger.frequentFlyerTier)} is not in context.tierOrder`);
    }
    if (!Array.isArray(passenger.ssrCodes) || passenger.ssrCodes.some((code) => typeof code !== 'string')) {
      throw new RangeError(`${field('ssrCodes')}: expected a list of SSR codes`);
    }
    for (const name of ['alreadyDeniedOnTicket', 'volunteered'] as const) {
      if (typeof passenger[name] !== 'boolean') throw new RangeError(`${field(name)}: expected true or false`);
    }
    for (const name of ['isChild', 'partySplitAgreed', 'seatAssignedBeforeGate'] as const) {
      if (passenger[name] !== undefined && typeof passenger[name] !== 'boolean') throw new RangeError(`${field(name)}: expected true or false`);
    }
    if (needsSeatFlag && passenger.seatAssignedBeforeGate === undefined) {
      throw new RangeError(`${field('seatAssignedBeforeGate')}: required because a rule uses seat-assigned-before-gate`);
    }
    if (passenger.age !== undefined && passenger.age !== null && (!Number.isInteger(passenger.age) || passenger.age < 0)) {
      throw new RangeError(`${field('age')}: expected a whole age in years`);
    }
    if (passenger.partySize !== undefined && (!Number.isInteger(passenger.partySize) || passenger.partySize < 1)) {
      throw new RangeError(`${field('partySize')}: expected a whole number of travellers, 1 or more`);
    }
    return {
      ...passenger,
      checkedInMs: passenger.checkedInAt === null ? null : parseIsoDateTime(field('checkedInAt'), passenger.checkedInAt),
      boardedMs: passenger.boardedAt === null ? null : parseIsoDateTime(field('boardedAt'), passenger.boardedAt),
      ssr: new Set(passenger.ssrCodes.map((code) => code.trim().toUpperCase())),
    };
  });
}

/** One formatter per zone: building an Intl.DateTimeFormat costs far more than formatting with one. */
const clockFormats = new Map<string, Intl.DateTimeFormat>();

export function formatClock(epochMs: number, timeZone: string): string {
  let format = clockFormats.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZone });
    clockFormats.set(timeZone, format);
  }
  return format.format(epochMs);
}
