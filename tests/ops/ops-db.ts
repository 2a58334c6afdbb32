import { randomUUID } from "node:crypto";
import { execFile } from "node:child_process";
import { promisify } from "node:util";
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import type { Database } from "@/db/types";

// Helpers of the operations suites: whole scratch databases in the test cluster (created through
// the cluster's superuser over its local socket, owned by the test role), and the project's own
// command-line scripts run as child processes, exactly as an operator runs them.
const run = promisify(execFile);

function requireEnv(name: "DATABASE_URL" | "PG_SUPERUSER_URL"): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run the operations tests through \`npm test\`.`);
  return value;
}

export interface ScratchDatabase {
  name: string;
  url: string;
  db: Kysely<Database>;
  drop(): Promise<void>;
}

async function admin<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: requireEnv("PG_SUPERUSER_URL") });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

/** An empty database named sealpitch_test_<label>_<random>, owned by the role of DATABASE_URL. */
export async function createScratchDatabase(label: string): Promise<ScratchDatabase> {
  const base = new URL(requireEnv("DATABASE_URL"));
  const name = `sealpitch_test_${label}_${randomUUID().slice(0, 8)}`;
  const owner = decodeURIComponent(base.username);
  await admin((client) => client.query(`create database "${name}" owner "${owner}"`));
  const url = new URL(base);
  url.pathname = `/${name}`;
  const db = new Kysely<Database>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url.toString(), max: 3 }) }),
  });
  return {
    name,
    url: url.toString(),
    db,
    async drop() {
      await db.destroy();
      await admin((client) => client.query(`drop database if exists "${name}" with (force)`));
    },
  };
}

export interface ScriptRun {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs `tsx --conditions=react-server scripts/<script> …args` with the given DATABASE_URL. */
export async function runScript(script: string, args: string[], databaseUrl: string): Promise<ScriptRun> {
  try {
    const { stdout, stderr } = await run(
      "npx",
      ["tsx", "--conditions=react-server", `scripts/${script}`, ...args],
      { env: { ...process.env, DATABASE_URL: databaseUrl }, timeout: 120_000 },
    );
    return { code: 0, stdout, stderr };
  } catch (error) {
    const failed = error as { code?: number; stdout?: string; stderr?: string };
    return { code: failed.code ?? 1, stdout: failed.stdout ?? "", stderr: failed.stderr ?? "" };
  }
}
