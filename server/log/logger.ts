import "server-only";
import pino, { type Logger } from "pino";
import { getEnv } from "@/server/env";

// The one logger of the server: pino, one JSON line per event on stdout (a log shipper or
// `journalctl` picks it up; `npx pino-pretty` makes it readable by hand). LOG_LEVEL sets the level.
// Lines carry only the fields we choose (ids, route, status, duration, counts, messages); request
// bodies, headers and documents are never passed in. The redact list is the second line of
// defence should a secret-bearing object reach a log call anyway.
export const REDACTED_PATHS = [
  "password",
  "newPassword",
  "currentPassword",
  "token",
  "sessionId",
  "cookie",
  "authorization",
  "document",
  "bytes",
  "*.password",
  "*.newPassword",
  "*.currentPassword",
  "*.token",
  "*.sessionId",
  "*.cookie",
  "*.authorization",
  "*.document",
  "*.bytes",
  'headers["set-cookie"]',
  "req.headers.cookie",
  "req.headers.authorization",
];

declare global {
  var sealpitchLogger: Logger | undefined;
}

export function createLogger(level: string, destination?: pino.DestinationStream): Logger {
  return pino(
    {
      level,
      base: { service: "sealpitch", pid: process.pid },
      timestamp: pino.stdTimeFunctions.isoTime,
      redact: { paths: REDACTED_PATHS, censor: "[redacted]" },
      formatters: { level: (label) => ({ level: label }) },
    },
    destination,
  );
}

/** The process's logger (created on first use, so `next build` reads no settings). */
export function getLogger(): Logger {
  globalThis.sealpitchLogger ??= createLogger(getEnv().LOG_LEVEL);
  return globalThis.sealpitchLogger;
}

/** The message of an unknown thrown value, for the `err` field. */
export function errorText(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
