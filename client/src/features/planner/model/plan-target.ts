import { iataAirportSchema } from '@shared/schemas/common';
import { FLIGHT_DESIGNATOR, buildRouteKey, routeKeySchema } from '@shared/schemas/plans';

export type TargetKind = 'route' | 'flight';

/** The route or future flight being planned; the origin is always the station's own airport. */
export interface TargetFields {
  kind: TargetKind;
  destination: string;
  designator: string;
  date: string;
}

export type TargetFieldName = 'destination' | 'designator' | 'date';

export const EMPTY_TARGET: TargetFields = { kind: 'route', destination: '', designator: '', date: '' };

export type TargetCheck = { ok: true; routeKey: string } | { ok: false; errors: Partial<Record<TargetFieldName, string>> };

/** Checks each part where it is typed, then the whole key with the shared schema the server applies. */
export function checkTarget(origin: string, t: TargetFields): TargetCheck {
  const errors: Partial<Record<TargetFieldName, string>> = {};
  const destination = t.destination.trim().toUpperCase();
  if (destination === '') errors.destination = 'Destination is required';
  else if (!iataAirportSchema.safeParse(destination).success) errors.destination = 'Destination must be a three-letter IATA airport code, such as ORD';
  else if (destination === origin) errors.destination = `Destination must differ from the origin ${origin}`;
  const designator = t.designator.trim().toUpperCase().replace(/\s/g, '');
  if (t.kind === 'flight') {
    if (designator === '') errors.designator = 'Flight is required';
    else if (!FLIGHT_DESIGNATOR.test(designator)) errors.designator = 'Flight must be a carrier code and number, such as BB123';
    if (t.date === '') errors.date = 'Date is required';
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  const routeKey = buildRouteKey({ origin, destination, ...(t.kind === 'flight' ? { flight: { designator, date: t.date } } : {}) });
  const parsed = routeKeySchema.safeParse(routeKey);
  if (!parsed.success) return { ok: false, errors: { [t.kind === 'flight' ? 'date' : 'destination']: parsed.error.issues[0].message } };
  return { ok: true, routeKey };
}
