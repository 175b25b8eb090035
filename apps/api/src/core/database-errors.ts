/**
 * Reads what went wrong from an error that came out of the database driver (directly, or wrapped
 * by Drizzle as the `cause` of a DrizzleQueryError). The error handler turns the answer into a
 * status; nothing else in the API inspects driver errors.
 */
export type DatabaseFailure =
  /**
   * A unique or foreign-key check lost a race with another request (SQLSTATE 23505, 23503): a
   * duplicate, a row pointing at a record just deleted, or a delete of a record just referenced.
   */
  | { kind: 'conflict'; reason: 'duplicate' | 'reference-gone' | 'still-referenced' }
  /** The database cannot be reached or is restarting; `reason` is one short line for the log. */
  | { kind: 'unavailable'; reason: string };

interface DriverError {
  code?: unknown;
  message?: unknown;
  cause?: unknown;
}

/** SQLSTATEs of a server that is going away or not yet ready (class 08: connection exception). */
const UNAVAILABLE_STATES = new Set(['57P01', '57P02', '57P03', '53300']);
/** Socket errors of a connection that failed or broke. */
const SOCKET_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'ENOTFOUND',
  'EAI_AGAIN',
  'EHOSTUNREACH',
]);
/** node-postgres raises these without a code when a connection drops or cannot be made in time. */
const DRIVER_MESSAGES = [
  /^Connection terminated/,
  /^timeout exceeded when trying to connect/,
  /^Client has encountered a connection error/,
  /^Connection closed/,
];

/** The error itself and each `cause` under it, outermost first. */
function* causes(err: unknown): Generator<DriverError> {
  for (let e = err, depth = 0; e && typeof e === 'object' && depth < 5; depth++) {
    yield e as DriverError;
    e = (e as DriverError).cause;
  }
}

/** What kind of database failure `err` is, or undefined when it is not one. */
export function databaseFailure(err: unknown): DatabaseFailure | undefined {
  for (const e of causes(err)) {
    const code = typeof e.code === 'string' ? e.code : '';
    const message = typeof e.message === 'string' ? e.message : '';
    if (code === '23505') return { kind: 'conflict', reason: 'duplicate' };
    if (code === '23503') {
      // PostgreSQL words the two directions differently: "insert or update on table …" versus
      // "update or delete on table …" (the referenced row's side).
      const side = /^update or delete on table/.test(message)
        ? 'still-referenced'
        : 'reference-gone';
      return { kind: 'conflict', reason: side };
    }
    if (code.startsWith('08') || UNAVAILABLE_STATES.has(code) || SOCKET_CODES.has(code)) {
      return { kind: 'unavailable', reason: oneLine(code, message) };
    }
    if (DRIVER_MESSAGES.some((pattern) => pattern.test(message))) {
      return { kind: 'unavailable', reason: oneLine(code, message) };
    }
  }
  return undefined;
}

function oneLine(code: string, message: string) {
  const first = (message.split('\n')[0] ?? '').slice(0, 200);
  return code ? `${first} (${code})` : first;
}
