import { describe, expect, it } from 'vitest';
import { isDatabaseUnavailable } from './unavailable';

// Error shapes as mysql2 3.x and TypeORM 1.x raise them (QueryFailedError keeps the driver's error in driverError).
describe('isDatabaseUnavailable', () => {
  it('knows a refused or lost connection, bare or wrapped', () => {
    expect(isDatabaseUnavailable(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3306'), { code: 'ECONNREFUSED' }))).toBe(true);
    expect(isDatabaseUnavailable({ message: 'Query failed', driverError: { code: 'PROTOCOL_CONNECTION_LOST', fatal: true } })).toBe(true);
    expect(isDatabaseUnavailable(new Error('outer', { cause: { code: 'ER_SERVER_SHUTDOWN' } }))).toBe(true);
  });
  it('leaves a refused query alone: that is a fault of ours or of the input, not of the connection', () => {
    expect(isDatabaseUnavailable({ driverError: { code: 'ER_DUP_ENTRY' } })).toBe(false);
    expect(isDatabaseUnavailable({ driverError: { code: 'ER_NO_REFERENCED_ROW_2' } })).toBe(false);
    expect(isDatabaseUnavailable(new Error('plain'))).toBe(false);
    expect(isDatabaseUnavailable(null)).toBe(false);
  });
});
