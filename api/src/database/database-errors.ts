// Errors that mean "PostgreSQL is not reachable right now" (as opposed to a bad query):
// connection refused/reset, server shutting down, connection failures, too many connections.
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'ENOTFOUND',
  'EAI_AGAIN',
  '57P01', // admin_shutdown
  '57P02', // crash_shutdown
  '57P03', // cannot_connect_now
  '08000', // connection_exception
  '08001', // sqlclient_unable_to_establish_sqlconnection
  '08003', // connection_does_not_exist
  '08006', // connection_failure
  '53300', // too_many_connections
]);

const UNAVAILABLE_MESSAGES = [
  'Connection terminated',
  'timeout exceeded when trying to connect',
  'Client has encountered a connection error',
  'Connection terminated unexpectedly',
];

type MaybeDbError = { code?: unknown; message?: unknown; driverError?: unknown; errors?: unknown };

/** True when the error (or the driver error TypeORM wraps) says the database cannot be reached. */
export function isDatabaseUnavailable(error: unknown, depth = 0): boolean {
  if (depth > 3 || typeof error !== 'object' || error === null) return false;
  const e = error as MaybeDbError;
  if (typeof e.code === 'string' && UNAVAILABLE_CODES.has(e.code)) return true;
  if (typeof e.message === 'string' && UNAVAILABLE_MESSAGES.some((m) => (e.message as string).includes(m)))
    return true;
  // AggregateError (e.g. ECONNREFUSED on both ::1 and 127.0.0.1) and TypeORM's QueryFailedError.
  if (Array.isArray(e.errors) && e.errors.some((inner) => isDatabaseUnavailable(inner, depth + 1)))
    return true;
  return e.driverError !== undefined && isDatabaseUnavailable(e.driverError, depth + 1);
}

/** PostgreSQL unique_violation. */
export function isUniqueViolation(error: unknown): boolean {
  if (typeof error !== 'object' || error === null) return false;
  const e = error as MaybeDbError;
  return e.code === '23505' || isUniqueViolation(e.driverError);
}

/**
 * PostgreSQL "Class 22 — Data Exception" (PostgreSQL documentation, Appendix A "PostgreSQL Error
 * Codes"): a value the request carried that the database cannot take — an invalid byte sequence
 * (22021), a date out of range (22008), a malformed number or date (22P02, 22007), a number out of
 * range (22003), text too long for its column (22001). The input's fault, not the server's.
 */
export function isBadValueForDatabase(error: unknown, depth = 0): boolean {
  if (depth > 3 || typeof error !== 'object' || error === null) return false;
  const e = error as MaybeDbError;
  if (typeof e.code === 'string' && /^22[0-9A-Z]{3}$/.test(e.code)) return true;
  return e.driverError !== undefined && isBadValueForDatabase(e.driverError, depth + 1);
}
