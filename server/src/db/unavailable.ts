// Whether a failure means the database could not be reached (down, restarting, connection cut), as opposed to a
// query it refused. Such a failure is worth a "try again shortly", never a 500: the request's transaction either
// committed before the connection went or was rolled back by the server with it.
const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH',
  // mysql2's names for a connection that died under a query or was used after dying.
  'PROTOCOL_CONNECTION_LOST', 'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR', 'PROTOCOL_ENQUEUE_AFTER_QUIT',
  // The server said it is going away: 1053 shutdown in progress, 1927 connection killed, 2006/2013 gone/lost.
  'ER_SERVER_SHUTDOWN', 'ER_CONNECTION_KILLED', 'CR_SERVER_GONE_ERROR', 'CR_SERVER_LOST',
]);

interface MaybeDriverError {
  code?: unknown;
  fatal?: unknown;
  driverError?: MaybeDriverError;
  cause?: unknown;
}

export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 3) return false;
  const e = err as MaybeDriverError;
  if (typeof e.code === 'string' && UNREACHABLE_CODES.has(e.code)) return true;
  return isDatabaseUnavailable(e.driverError, depth + 1) || isDatabaseUnavailable(e.cause, depth + 1);
}
