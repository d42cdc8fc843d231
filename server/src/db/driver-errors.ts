// The MariaDB error code under a failure, however TypeORM wrapped it (QueryFailedError keeps the driver's error in
// `driverError`; a bare mysql2 error carries `code` itself).
export function driverErrorCode(err: unknown): string | undefined {
  const e = err as { code?: unknown; driverError?: { code?: unknown } } | null | undefined;
  const code = e?.driverError?.code ?? e?.code;
  return typeof code === 'string' ? code : undefined;
}

/** A unique key refused the row: someone else holds that value. */
export const isDuplicateKey = (err: unknown): boolean => driverErrorCode(err) === 'ER_DUP_ENTRY';
