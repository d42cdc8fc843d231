// Synchronizer-token CSRF protection: the token lives in the session and comes back in a header on every
// state-changing request.
import { csrfSync } from 'csrf-sync';

export const CSRF_HEADER = 'x-csrf-token';

export const { csrfSynchronisedProtection, generateToken } = csrfSync({
  getTokenFromRequest: (req) => req.headers[CSRF_HEADER] as string | undefined,
});
