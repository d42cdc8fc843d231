import { compensationDue, type CompensationResult, type Regime } from '@shared/compensation';
import { denialCostHelperSchema, totalDenialCostMinor } from '@shared/schemas/planner';
import { parseMoneyText } from './money-text';

/** A typical involuntary denial at the station, and what the carrier adds on top of the regulated amount. */
export interface CostHelperFields {
  fare: string;
  delayHours: string;
  distanceKm: string;
  international: boolean;
  intraCommunity: boolean;
  rebooking: string;
  goodwill: string;
}

export type CostHelperFieldName = 'fare' | 'delayHours' | 'distanceKm' | 'rebooking' | 'goodwill';

export const EMPTY_COST_HELPER: CostHelperFields = {
  fare: '',
  delayHours: '3',
  distanceKm: '',
  international: false,
  intraCommunity: true,
  rebooking: '',
  goodwill: '',
};

export interface CostHelperOutcome {
  compensation?: CompensationResult;
  /** Compensation + rebooking + goodwill, in minor units of the compensation's currency. */
  totalMinor?: number;
  errors: Partial<Record<CostHelperFieldName | 'form', string>>;
}

export interface CostHelperContext {
  regime: Regime;
  /** The day whose rules apply: the amounts in force then. */
  deniedOn: string;
  /** Currency of the amounts the planner types: the station's. */
  currency: string;
  /** Used as the typical fare when none is typed. */
  revenuePerBookingMinor?: number;
  aircraftSeats?: number;
}

const ENGINE_FIELD: Partial<Record<string, CostHelperFieldName>> = {
  oneWayFare: 'fare',
  plannedArrivalDelayMinutes: 'delayHours',
  distanceKm: 'distanceKm',
};

const ENGINE_LABEL: Record<CostHelperFieldName, string> = {
  fare: 'Typical fare',
  delayHours: 'Delay',
  distanceKm: 'Distance',
  rebooking: 'Rebooking cost',
  goodwill: 'Goodwill',
};

function hoursToMinutes(text: string): number | undefined {
  const hours = Number(text.trim().replace(',', '.'));
  return text.trim() === '' || !Number.isFinite(hours) || hours < 0 ? undefined : Math.round(hours * 60);
}

/** Runs the shared compensation rules for the typical case, then adds the carrier's own costs with the shared schema. */
export function buildDenialCost(f: CostHelperFields, ctx: CostHelperContext): CostHelperOutcome {
  const errors: CostHelperOutcome['errors'] = {};
  const fare = parseMoneyText(f.fare, ctx.currency, 'Typical fare');
  if (!fare.ok) errors.fare = fare.message;
  const delay = hoursToMinutes(f.delayHours);
  if (delay === undefined) errors.delayHours = 'Delay must be a number of hours, 0 or more, such as 3';
  const distance = f.distanceKm.trim() === '' ? undefined : Number(f.distanceKm.trim());
  const rebooking = parseMoneyText(f.rebooking, ctx.currency, 'Rebooking cost');
  const goodwill = parseMoneyText(f.goodwill, ctx.currency, 'Goodwill');
  if (!rebooking.ok) errors.rebooking = rebooking.message;
  if (!goodwill.ok) errors.goodwill = goodwill.message;

  let compensation: CompensationResult | undefined;
  if (fare.ok && delay !== undefined) {
    const fareMinor = fare.minor ?? ctx.revenuePerBookingMinor;
    try {
      compensation = compensationDue({
        regime: ctx.regime,
        deniedOn: ctx.deniedOn,
        plannedArrivalDelayMinutes: delay,
        ...(ctx.regime === 'us-dot'
          ? { oneWayFare: fareMinor === undefined ? undefined : { amountMinor: fareMinor, currency: ctx.currency }, international: f.international, aircraftSeats: ctx.aircraftSeats }
          : {}),
        ...(ctx.regime === 'eu-261' || ctx.regime === 'uk-261' ? { distanceKm: distance, intraCommunity: f.intraCommunity } : {}),
      });
    } catch (err) {
      // the rules name the input they refused before a colon: show it beside that field
      const message = err instanceof Error ? err.message : String(err);
      const field = ENGINE_FIELD[message.split(/[:.]/)[0]] ?? 'form';
      const rule = field === 'form' ? message : `${ENGINE_LABEL[field]}: ${message.slice(message.indexOf(':') + 1).trim()}`;
      errors[field] = field === 'fare' && fareMinor === undefined ? 'Type a typical fare, or the revenue per booking above' : rule;
    }
  }
  if (compensation && compensation.currency !== ctx.currency) {
    errors.form = `The rules pay in ${compensation.currency} but this station plans in ${ctx.currency}: convert the amount and type the cost yourself.`;
    return { compensation, errors };
  }
  if (!compensation || !rebooking.ok || !goodwill.ok) return { compensation, errors };

  const parts = denialCostHelperSchema.safeParse({
    averageCompensationMinor: compensation.amountMinor,
    rebookingCostMinor: rebooking.minor ?? 0,
    goodwillMinor: goodwill.minor ?? 0,
  });
  if (!parts.success) {
    for (const issue of parts.error.issues) {
      const key = String(issue.path[0]);
      const field = key === 'rebookingCostMinor' ? 'rebooking' : key === 'goodwillMinor' ? 'goodwill' : 'form';
      errors[field] ??= issue.message.replace(/^\w+Minor/, field === 'rebooking' ? 'Rebooking cost' : field === 'goodwill' ? 'Goodwill' : 'Compensation');
    }
    return { compensation, errors };
  }
  return { compensation, totalMinor: totalDenialCostMinor(parts.data), errors };
}
