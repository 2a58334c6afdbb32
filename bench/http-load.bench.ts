/**
 * HTTP load against the throw-away stack that `npm run bench` starts (a production build on
 * APP_URL, the test database on DATABASE_URL): autocannon from npm drives
 *  - GET /api/v1/designs/:id of a stored 96-bolt flange at 10 and 50 connections, and again with
 *    the ETag it answered (If-None-Match, so 304s),
 *  - GET /api/v1/designs (the Joint register's first page),
 *  - POST /api/v1/analyses with the 96-bolt document at 10 connections, while a second client
 *    polls /api/health and records its latency,
 *  - GET /api/health alone,
 * and pgbench (PostgreSQL's own load tool) reads the same design and revision rows at 10
 * connections, so the design read is also printed as a share of the database's own rate.
 * Prints req/s, median and p99 latency per case. A benchmark: nothing here fails on time. Every
 * load is bounded in time and sent only to the loopback app and database of this run.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import autocannon from "autocannon";
import { sql } from "kysely";
import { getDb } from "@/db/index";
import { getLucia, SESSION_COOKIE_NAME } from "@/server/auth/lucia";
import { girthFlange96 } from "@/tests/features/analysis/core/fixtures";
import { figure } from "./report";

const DESIGNER = "dana.designer@kestrel-ridge.example";
const SECONDS = 8;

interface Load {
  reqPerSec: number;
  p50: number;
  p99: number;
  non2xx: number;
  errors: number;
  statuses: string;
}

async function load(
  url: string,
  options: { connections: number; method?: string; body?: string; headers?: Record<string, string> },
  seconds = SECONDS,
  overallRate?: number,
): Promise<Load> {
  const result = await autocannon({
    url,
    connections: options.connections,
    duration: seconds,
    method: options.method ?? "GET",
    body: options.body,
    headers: options.headers,
    timeout: 30,
    ...(overallRate ? { overallRate } : {}),
  });
  const statuses = Object.entries(result.statusCodeStats ?? {})
    .map(([code, s]) => `${code}×${s.count}`)
    .join(" ");
  return {
    reqPerSec: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors + result.timeouts,
    statuses,
  };
}

/** A load's cell in the README table: rate and latencies, and any errors. */
function loadCell(l: Load, body?: string): string {
  const p99 = l.p99 >= 1000 ? `${(l.p99 / 1000).toFixed(1)} s` : `${l.p99} ms`;
  return `${l.reqPerSec.toFixed(0)} req/s, median ${l.p50} ms, p99 ${p99}${body ? `, ${body}` : ""}${l.errors > 0 ? `, ${l.errors} errors` : ""}`;
}

function line(label: string, l: Load): void {
  const extra = l.errors > 0 ? `  errors ${l.errors}` : "";
  console.log(
    `http: ${label.padEnd(54)} ${l.reqPerSec.toFixed(0).padStart(5)} req/s  median ${String(l.p50).padStart(4)} ms  p99 ${String(l.p99).padStart(5)} ms  [${l.statuses}]${extra}`,
  );
}

async function reachable(url: string): Promise<boolean> {
  try {
    return (await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(3000) })).ok;
  } catch {
    return false;
  }
}

/** pgbench reading the design's rows the way the design read did before #17 (every column). */
function pgbench(databaseUrl: string, organizationId: string, designId: string): number | string {
  const bin = process.env.PG_BIN ? join(process.env.PG_BIN, "pgbench") : "pgbench";
  const dir = mkdtempSync(join(tmpdir(), "sealpitch-pgbench-"));
  try {
    const script = join(dir, "design-read.sql");
    writeFileSync(
      script,
      `SELECT d.id, d.organization_id, d.name, d.equipment_tag, d.outline_kind, d.owner_id, d.updated_at,
  d.archived_at, o.display_name, e.display_name, r.id, r.number, r.status, r.version, r.document,
  r.result, r.core_version, r.updated_at,
  (SELECT count(*) FROM design_revisions a WHERE a.design_id = d.id),
  EXISTS (SELECT 1 FROM design_revisions s WHERE s.design_id = d.id AND s.submitted_at IS NOT NULL)
FROM designs d JOIN design_revisions r ON r.design_id = d.id
  JOIN users o ON o.id = d.owner_id JOIN users e ON e.id = r.last_edited_by
WHERE d.organization_id = '${organizationId}' AND r.organization_id = '${organizationId}' AND d.id = '${designId}'
  AND r.number = (SELECT max(l.number) FROM design_revisions l WHERE l.design_id = d.id);
`,
    );
    const run = spawnSync(
      bin,
      ["-n", "-c", "10", "-j", "2", "-T", String(SECONDS), "-f", script, databaseUrl],
      {
        encoding: "utf8",
      },
    );
    if (run.error) return `pgbench not runnable (${run.error.message}); Debian's postgresql-15 ships it`;
    const tps = /tps = ([\d.]+) \(without initial connection time\)/.exec(run.stdout);
    return tps ? Number(tps[1]) : `pgbench gave no tps: ${(run.stderr || run.stdout).trim().slice(0, 200)}`;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export async function run(): Promise<void> {
  // A script outside the app: it reads its settings directly (the app's env.ts is server code).
  const appUrl = process.env.APP_URL ?? "http://127.0.0.1:3100";
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl || !(await reachable(appUrl))) {
    console.log(
      `http: no app at ${appUrl} (or no DATABASE_URL); run it via \`npm run bench\`, which starts both`,
    );
    return;
  }
  const db = getDb();
  const member = await db
    .selectFrom("users")
    .innerJoin("memberships", "memberships.user_id", "users.id")
    .select(["users.id", "memberships.organization_id"])
    .where("users.email", "=", DESIGNER)
    .executeTakeFirstOrThrow();
  const session = await getLucia().createSession(member.id, {
    active_organization_id: member.organization_id,
  });
  const cookie = `${SESSION_COOKIE_NAME}=${session.id}`;
  const origin = new URL(appUrl).origin;
  const document = girthFlange96();
  const created = await fetch(`${appUrl}/api/v1/designs`, {
    method: "POST",
    headers: { cookie, origin, "content-type": "application/json" },
    body: JSON.stringify({ name: `HTTP bench 96 bolts ${Date.now()}`, equipmentTag: "HB-96", document }),
  });
  if (!created.ok) {
    console.log(`http: could not create the bench design (${created.status}): skipped`);
    return;
  }
  const { designId: bigId } = (await created.json()) as { designId: string };
  // The demo design with the largest stored result (what the issue's figures were read on), and
  // the 96-bolt flange just created (about 1 MB of stored result, most of it the profiles).
  const demo = await db
    .selectFrom("design_revisions")
    .innerJoin("designs", "designs.id", "design_revisions.design_id")
    .select("designs.id")
    .where("designs.organization_id", "=", member.organization_id)
    .where("designs.id", "!=", bigId)
    .orderBy(sql`pg_column_size(design_revisions.result)`, "desc")
    .executeTakeFirstOrThrow();
  const auth = { cookie };
  const reads: { label: string; row: string; designId: string; read10?: Load; body?: string }[] = [
    { label: "demo design", row: "demo design", designId: demo.id },
    { label: "96 bolts", row: "96-bolt flange", designId: bigId },
  ];
  for (const r of reads) {
    const url = `${appUrl}/api/v1/designs/${r.designId}`;
    const first = await fetch(url, { headers: auth });
    const bytes = (await first.arrayBuffer()).byteLength;
    r.body = `${(bytes / 1024).toFixed(0)} KB`;
    const etag = first.headers.get("etag");
    console.log(
      `http: design read (${r.label}) body ${(bytes / 1024).toFixed(1)} KB, ETag ${etag ? "yes" : "none"}`,
    );
    await load(url, { connections: 10, headers: auth }, 2); // warm-up
    r.read10 = await load(url, { connections: 10, headers: auth });
    line(`GET /api/v1/designs/:id (${r.label}), 10 connections`, r.read10);
    const read50 = await load(url, { connections: 50, headers: auth });
    line(`GET /api/v1/designs/:id (${r.label}), 50 connections`, read50);
    figure(`\`GET /api/v1/designs/:id\`, ${r.row}, 50 connections`, loadCell(read50));
    if (etag) {
      const revalidate = { ...auth, "if-none-match": etag };
      const fresh = await load(url, { connections: 10, headers: revalidate });
      line(`GET /api/v1/designs/:id (${r.label}), If-None-Match, 10 conn.`, fresh);
      figure(`\`GET /api/v1/designs/:id\`, ${r.row}, If-None-Match (304), 10 connections`, loadCell(fresh));
    }
  }
  const list = await load(`${appUrl}/api/v1/designs`, { connections: 10, headers: auth });
  line("GET /api/v1/designs (register page 1), 10 connections", list);
  figure("`GET /api/v1/designs` (the register), 10 connections", loadCell(list), { goal: "≥ 500 req/s" });
  const healthAlone = await load(`${appUrl}/api/health`, { connections: 10 });
  line("GET /api/health alone, 10 connections", healthAlone);
  figure("`GET /api/health` alone, 10 connections", loadCell(healthAlone));

  const analysisBody = JSON.stringify({ document });
  const analysisHeaders = { cookie, origin, "content-type": "application/json" };
  const [analyses, health] = await Promise.all([
    load(`${appUrl}/api/v1/analyses`, {
      connections: 10,
      method: "POST",
      body: analysisBody,
      headers: analysisHeaders,
    }),
    load(`${appUrl}/api/health`, { connections: 2 }, SECONDS, 20),
  ]);
  line("POST /api/v1/analyses (96 bolts), 10 connections", analyses);
  line("  GET /api/health (20/s) while analyses run", health);
  figure("`POST /api/v1/analyses`, 96 bolts, 10 connections", loadCell(analyses), { goal: "≥ 2× before" });
  figure("`GET /api/health` (20/s) while those analyses run", loadCell(health), { goal: "p99 < 100 ms" });

  for (const r of reads) {
    const tps = pgbench(databaseUrl, member.organization_id, r.designId);
    const readRow = `\`GET /api/v1/designs/:id\`, ${r.row}, 10 connections`;
    if (typeof tps === "string") {
      console.log(`http: pgbench skipped: ${tps}`);
      for (const rest of reads.slice(reads.indexOf(r)))
        figure(
          `\`GET /api/v1/designs/:id\`, ${rest.row}, 10 connections`,
          loadCell(rest.read10!, rest.body),
          {
            goal: "≥ 30 % of pgbench",
            ratio: `pgbench skipped: ${tps}`,
          },
        );
      break;
    }
    const label = `pgbench, the same design + revision rows (${r.label}), 10 conn.`;
    console.log(`http: ${label.padEnd(54)} ${tps.toFixed(0).padStart(5)} tx/s`);
    const share = (100 * r.read10!.reqPerSec) / tps;
    console.log(
      `http: design read (${r.label}) at 10 connections / pgbench = ${share.toFixed(1)} % (goal ≥ 30 %)`,
    );
    figure(readRow, loadCell(r.read10!, r.body), {
      goal: "≥ 30 % of pgbench",
      ratio: `${share.toFixed(1)} % of pgbench`,
    });
    figure(
      `pgbench on the same design + revision rows (every column), ${r.row}, 10 connections`,
      `${tps.toFixed(0)} tx/s`,
    );
  }
  await getLucia().invalidateSession(session.id);
}
