import { z } from 'zod';
import { currencySchema, regimeSchema } from './common';

export const stationSchema = z.object({
  id: z.number(),
  iata: z.string(),
  name: z.string(),
  timeZone: z.string(),
  regime: regimeSchema,
  currency: currencySchema,
  riskTolerance: z.number(),
});
export type Station = z.infer<typeof stationSchema>;
export const stationListSchema = z.object({ stations: z.array(stationSchema) });
