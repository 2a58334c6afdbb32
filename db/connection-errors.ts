// Whether an error means "the database cannot be reached right now" (refused, reset or timed-out
// connection, a server shutting down or starting up), as opposed to a query the database refused.
// Route handlers answer those with 503 and Retry-After instead of an empty 500; the pool reconnects
// on the next request by itself, so nothing needs a restart.
const NETWORK_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENETUNREACH",
  "ENOTFOUND",
  "EAI_AGAIN",
  "EPIPE",
]);
// SQLSTATE class 08 (connection exception), 57P01–57P03 (admin/crash shutdown, cannot connect now),
// 53300 (too many connections).
const SQLSTATE = /^(08|57P0[123]$|53300$)/;
const MESSAGES = [
  /connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /connection (was )?refused/i,
  /Client has encountered a connection error/i,
];

export function isDatabaseUnavailable(error: unknown, depth = 0): boolean {
  if (!error || typeof error !== "object" || depth > 4) return false;
  const { code, message, cause, errors } = error as {
    code?: unknown;
    message?: unknown;
    cause?: unknown;
    errors?: unknown;
  };
  if (typeof code === "string" && (NETWORK_CODES.has(code) || SQLSTATE.test(code))) return true;
  if (typeof message === "string" && MESSAGES.some((m) => m.test(message))) return true;
  // AggregateError (several addresses tried) and wrapped causes.
  if (Array.isArray(errors) && errors.some((e) => isDatabaseUnavailable(e, depth + 1))) return true;
  return isDatabaseUnavailable(cause, depth + 1);
}

/** Seconds a client should wait before trying again (the Retry-After header). */
export const DATABASE_RETRY_AFTER_SECONDS = 5;
