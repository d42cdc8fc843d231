// Listed by hand: a glob of .ts files does not load inside vitest. Append new migrations at the end.
import { Initial1796151413508 } from './1796151413508-Initial';
import { SessionsAndAuditGuard1796151413600 } from './1796151413600-SessionsAndAuditGuard';
import { LiveFlightDesk1796152035497 } from './1796152035497-LiveFlightDesk';
import { VolunteerRounds1796152709441 } from './1796152709441-VolunteerRounds';
import { SavedPlans1796151413700 } from './1796151413700-SavedPlans';
import { Outbox1796152300000 } from './1796152300000-Outbox';
import { Compensations1796153183331 } from './1796153183331-Compensations';
import { Payments1796153500000 } from './1796153500000-Payments';
import { Denials1796153400000 } from './1796153400000-Denials';
import { ForecastVersion1796270000000 } from './1796270000000-ForecastVersion';

export const migrations = [Initial1796151413508, SessionsAndAuditGuard1796151413600, LiveFlightDesk1796152035497, SavedPlans1796151413700, VolunteerRounds1796152709441, Outbox1796152300000, Compensations1796153183331, Denials1796153400000, Payments1796153500000, ForecastVersion1796270000000];
