// The job worker's last line of defence. pg-boss 10 calls complete() and fail() after a handler
// without awaiting them (node_modules/pg-boss/src/manager.js, `watch`), so when PostgreSQL drops the
// connection at that moment the rejection reaches nobody; Node 15+ then ends the process
// (--unhandled-rejections=throw, the default: Node.js documentation, "Command-line options").
// Here such rejections and lost-connection errors are logged and the worker goes on: pg-boss and
// TypeORM open new connections on the next query. Anything else thrown out of an event handler
// leaves the process in an unknown state (Node.js documentation, "process: Warning: Using
// 'uncaughtException' correctly"), so the worker exits non-zero and its supervisor
// (scripts/supervise.mjs or systemd) starts a new one.

/** Node and pg error codes and messages that mean "the connection to PostgreSQL (or SMTP) went away". */
const CONNECTION_CODES = new Set([
  'ECONNRESET',
  'ECONNREFUSED',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
]);
const CONNECTION_MESSAGES = [
  /connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /connection timeout/i,
];

/**
 * True for a lost or refused connection: a Node socket error, a pg client message, or a PostgreSQL
 * SQLSTATE of class 08 (connection exception) or 57P01–57P03 (server shutting down or starting;
 * PostgreSQL documentation, Appendix A "Error Codes").
 */
export function isConnectionError(error: unknown): boolean {
  if (!(error instanceof Error)) return false;
  const code = (error as { code?: unknown }).code;
  if (
    typeof code === 'string' &&
    (CONNECTION_CODES.has(code) || code.startsWith('08') || /^57P0[123]$/.test(code))
  )
    return true;
  return CONNECTION_MESSAGES.some((pattern) => pattern.test(error.message));
}

const describe = (error: unknown): string =>
  error instanceof Error ? `${error.message}${error.stack ? `\n${error.stack}` : ''}` : String(error);

export type Guarded = { error: (message: string) => void };

/**
 * Installs the process-wide handlers: every unhandled rejection is logged; an uncaught exception
 * is logged, and unless it is a lost connection the process exits with code 1.
 */
export function installProcessGuards(
  logger: Guarded,
  exit: (code: number) => void = (code) => process.exit(code),
): void {
  process.on('unhandledRejection', (reason) => {
    logger.error(`Unhandled rejection (the worker goes on): ${describe(reason)}`);
  });
  process.on('uncaughtException', (error) => {
    if (isConnectionError(error)) {
      logger.error(`Lost a connection (the worker goes on): ${describe(error)}`);
      return;
    }
    logger.error(`Uncaught exception, exiting so the supervisor starts a new worker: ${describe(error)}`);
    exit(1);
  });
}
