// Listed by hand: a glob of .ts files does not load inside vitest. Append new migrations at the end.
import { Initial1796151413508 } from './1796151413508-Initial';
import { SessionsAndAuditGuard1796151413600 } from './1796151413600-SessionsAndAuditGuard';

export const migrations = [Initial1796151413508, SessionsAndAuditGuard1796151413600];
