/**
 * Recognises errors that mean "the database cannot be reached right now" (as opposed to a bad
 * query): connection refused/reset/lost, timeouts, too many connections, server shutting down.
 */
const connectionErrorCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  'EPIPE',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'ER_SERVER_GONE_ERROR',
  'ER_SERVER_LOST',
  'ER_CONNECTION_KILLED',
  'POOL_CLOSED',
  'POOL_ENQUEUELIMIT',
]);

const connectionMessages = [/Can't add new command when connection is in closed state/i, /Pool is closed/i, /Connection lost/i];

export class DatabaseNotReadyError extends Error {
  readonly code = 'DB_NOT_READY';
  constructor() {
    super('The database connection is not ready yet.');
    this.name = 'DatabaseNotReadyError';
  }
}

export function isDbUnavailableError(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 4) return false;
  if (err instanceof DatabaseNotReadyError) return true;
  const e = err as { code?: unknown; message?: unknown; driverError?: unknown; cause?: unknown; errors?: unknown };
  if (typeof e.code === 'string' && (connectionErrorCodes.has(e.code) || e.code === 'DB_NOT_READY')) return true;
  if (typeof e.message === 'string' && connectionMessages.some((re) => re.test(e.message as string))) return true;
  if (Array.isArray(e.errors) && e.errors.some((x) => isDbUnavailableError(x, depth + 1))) return true;
  return isDbUnavailableError(e.driverError, depth + 1) || isDbUnavailableError(e.cause, depth + 1);
}

export const dbUnavailableMessage =
  'The database is not reachable right now. Millrace keeps retrying; try again in a moment.';
