// The edge raises the same failures the domain does (validate, requireRole, CSRF, routes); the error handler maps
// their kind to a status through http/error-status.ts.
export * from '../domain/errors';
