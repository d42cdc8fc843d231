// Which carrier this installation works for: from configuration, never from the demo scenario, except that a demo
// installation without a configured name uses the invented carrier it shows.
import { DEMO_CARRIER } from '../demo/scenario';
import type { Env } from './env';

export function carrierNameFrom(env: Pick<Env, 'CARRIER_NAME'>, demo: boolean): string {
  if (env.CARRIER_NAME) return env.CARRIER_NAME;
  if (demo) return DEMO_CARRIER.name;
  throw new Error('Configuration error: CARRIER_NAME: set the operating carrier named in written statements');
}
