import "server-only";
import { z } from "zod";

// Every server setting, parsed once. This is the only module that reads process.env (the
// scripts under scripts/ set these variables; see .env.example). A bad or missing value stops
// the process with one message that lists every problem at once.
const booleanString = z.enum(["true", "false", "1", "0"]).transform((v) => v === "true" || v === "1");

const envSchema = z.object({
  NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
  DATABASE_URL: z
    .string({ error: "is missing" })
    .regex(/^postgres(ql)?:\/\//, "must be a postgres:// connection URL"),
  /**
   * The owner role's connection, used only by `npm run db:migrate` (migrations, the job queue's
   * schema, the runtime role's grants). The app itself never reads it. Falls back to DATABASE_URL.
   */
  MIGRATION_DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, "must be a postgres:// connection URL")
    .optional(),
  /**
   * PostgreSQL connections of the app's request pool. Under the web launcher (scripts/serve.ts)
   * this is the budget of the whole instance, split between its web workers (at least 2 each).
   */
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  /**
   * `next start` processes the web launcher (scripts/serve.ts, used by `npm start` and the bench)
   * runs on one port through Node's cluster module. Unset: the machine's cores; the test stack sets 1.
   */
  WEB_WORKERS: z.coerce.number().int().min(1).max(64).optional(),
  APP_URL: z.url({ error: "must be the public origin of the app, e.g. http://127.0.0.1:3000" }),
  SMTP_HOST: z.string({ error: "is missing" }).min(1, "is empty"),
  SMTP_PORT: z.coerce.number({ error: "must be a port number" }).int().min(1).max(65535),
  SMTP_SECURE: booleanString.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default("Sealpitch <no-reply@sealpitch.local>"),
  SESSION_IDLE_DAYS: z.coerce.number().int().min(1).max(90).default(14),
  /**
   * How many reverse proxies in front of the app append to X-Forwarded-For (README "Security").
   * 0 (no proxy): the address is the TCP peer that Next's server writes into that header.
   */
  TRUST_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(0),
  /** Sheet-queue workers this process runs (0: it only queues, another instance works the jobs). */
  JOB_WORKERS: z.coerce.number().int().min(0).max(8).default(1),
  /**
   * Worker threads that run analyses off the request thread (server/analysis/pool.ts). Unset: one
   * fewer than the machine's cores, at least 1.
   */
  ANALYSIS_WORKERS: z.coerce.number().int().min(1).max(64).optional(),
  /** Longest one analysis may run in its worker before it is stopped and the worker replaced. */
  ANALYSIS_TIME_LIMIT_MS: z.coerce.number().int().min(10).max(600_000).default(20_000),
  /** FE cross-check workers this process runs (each keeps one core busy while it solves; 0: none here). */
  FE_WORKERS: z.coerce.number().int().min(0).max(8).default(1),
  /** Wall-time limit of one FE cross-check run, s. */
  FE_TIME_LIMIT_SECONDS: z.coerce.number().int().min(10).max(3600).default(600),
  /**
   * How often an open desk asks for its review lists again, ms (the desk's SWR refresh). 3 s by
   * default; the test stack sets it lower so its browser tests wait less for a list to change.
   */
  DESK_REFRESH_MS: z.coerce.number().int().min(250).max(60_000).default(3000),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  /** Bearer token for GET /api/metrics; unset (the default) turns the endpoint off (404). */
  METRICS_TOKEN: z.string().min(24, "must be at least 24 characters").optional(),
});

export type ServerEnv = z.infer<typeof envSchema>;

export class ConfigurationError extends Error {
  override name = "ConfigurationError";
}

/** Parses a variables object; exported for tests and scripts that pass their own. */
export function parseEnv(source: Record<string, string | undefined>): ServerEnv {
  const result = envSchema.safeParse(source);
  if (result.success) return result.data;
  throw new ConfigurationError(describeProblems(result.error.issues));
}

/** Parses only the named settings; for command-line scripts that need a few of them. */
export function parseEnvKeys<K extends keyof ServerEnv>(
  keys: K[],
  source: Record<string, string | undefined> = process.env,
): Pick<ServerEnv, K> {
  const mask = Object.fromEntries(keys.map((key) => [key, true])) as Record<K, true>;
  const result = envSchema.pick(mask as never).safeParse(source);
  if (result.success) return result.data as Pick<ServerEnv, K>;
  throw new ConfigurationError(describeProblems(result.error.issues));
}

function describeProblems(issues: z.core.$ZodIssue[]): string {
  const problems = issues.map((issue) => `${issue.path.join(".") || "(env)"} ${issue.message}`);
  return `Sealpitch configuration is invalid: ${problems.join("; ")}.`;
}

let cached: ServerEnv | undefined;

/** The validated settings of this process (parsed on first use, so `next build` needs none). */
export function getEnv(): ServerEnv {
  cached ??= parseEnv(process.env);
  return cached;
}

/** True when the app is served over plain http on a loopback address (local development and tests). */
export function isLoopbackHttp(env: ServerEnv = getEnv()): boolean {
  const url = new URL(env.APP_URL);
  return url.protocol === "http:" && ["127.0.0.1", "localhost", "[::1]"].includes(url.hostname);
}
