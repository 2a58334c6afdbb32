// `npm run generate:org -- --designs 1000`: a large organisation for backup timings and load
// tests, in our own invented scenario (Kestrel Ridge's sister site, "Halden Creek North yard").
// Each design gets one attachment (a generated datasheet PDF of --attachment-kb kilobytes, random
// body so it does not compress away); every --approve-every-th design is submitted, approved by a
// second person (every warn/fail check justified) and gets a finished spacing sheet in
// export_files, so a backup holds every kind of row the product keeps. Writes through the app's
// own mutations (createDesign, uploadAttachment, submit/approve, runSheetJob), never raw inserts.
// Prints what it made and how long it took. Not idempotent: every run makes a new organisation.
import { randomBytes, randomUUID } from "node:crypto";
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import type { Database } from "@/db/types";
import type { Role } from "@/db/tables/core";
import { buildCircularFlange } from "@/features/designs/model/templates";
import { createDesign } from "@/features/designs/mutations";
import { uploadAttachment } from "@/features/attachments/mutations";
import { readChecks } from "@/features/reviews/model/review-checks";
import { rulesNeedingJustification } from "@/features/analysis/rule-groups";
import { approveRevision, submitRevision, type TransitionActor } from "@/features/reviews/transitions";
import { exportFileName, CONTENT_TYPES } from "@/features/exports/file-names";
import { createExportFile } from "@/server/jobs/export-files";
import { runSheetJob } from "@/features/exports/sheet-job";
import { parseEnvKeys } from "@/server/env";

interface Options {
  designs: number;
  attachmentKb: number;
  approveEvery: number;
}

function parseArgs(argv: string[]): Options {
  const options: Options = { designs: 1000, attachmentKb: 48, approveEvery: 10 };
  for (let i = 0; i < argv.length; i++) {
    const value = Number(argv[i + 1]);
    const key = argv[i];
    if (key === "--designs") options.designs = value;
    else if (key === "--attachment-kb") options.attachmentKb = value;
    else if (key === "--approve-every") options.approveEvery = value;
    else throw new Error(`unknown option ${key} (use --designs N, --attachment-kb N, --approve-every N)`);
    if (!Number.isInteger(value) || value < 1) throw new Error(`${key} needs a whole number of at least 1`);
    i++;
  }
  return options;
}

/** A small, valid-looking PDF header followed by random bytes: sniffed as PDF, incompressible. */
function datasheetBytes(kb: number, index: number): Uint8Array {
  const head = Buffer.from(`%PDF-1.4\n% Halden Creek North datasheet ${index}\n`, "latin1");
  return new Uint8Array(Buffer.concat([head, randomBytes(Math.max(0, kb * 1024 - head.length))]));
}

export async function generateOrganisation(
  db: Kysely<Database>,
  options: Options,
  log: (line: string) => void = () => {},
): Promise<{
  organizationId: string;
  designs: number;
  approved: number;
  attachments: number;
  sheets: number;
}> {
  const tag = randomUUID().slice(0, 8);
  const org = await db
    .insertInto("organizations")
    .values({ name: `Halden Creek North yard ${tag}`, slug: `halden-north-${tag}` })
    .returning("id")
    .executeTakeFirstOrThrow();
  const person = async (who: string, roles: Role[]): Promise<TransitionActor> => {
    const user = await db
      .insertInto("users")
      .values({
        email: `${who}.${tag}@halden-north.example`,
        display_name: `${who} ${tag}`,
        password_hash: null,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db.insertInto("memberships").values({ organization_id: org.id, user_id: user.id, roles }).execute();
    return { userId: user.id, organizationId: org.id, roles };
  };
  const designer = await person("designer", ["designer"]);
  const approver = await person("approver", ["approver"]);
  const counts = { organizationId: org.id, designs: 0, approved: 0, attachments: 0, sheets: 0 };
  for (let i = 1; i <= options.designs; i++) {
    const name = `HCN-${String(i).padStart(4, "0")} nozzle flange`;
    const boltCount = 8 + 4 * (i % 6);
    const equipmentTag = `HCN-E${100 + (i % 900)}`;
    const document = buildCircularFlange(
      { name, equipmentTag, units: "SI" },
      {
        outsideDiameterMm: 300 + 10 * boltCount,
        boreDiameterMm: 150 + 5 * boltCount,
        boltCircleDiameterMm: 250 + 10 * boltCount,
        boltCount,
        boltSize: "M20",
        flangeThicknessMm: 30,
      },
    );
    const { designId } = await createDesign(db, {
      organizationId: org.id,
      ownerId: designer.userId,
      name,
      equipmentTag,
      document,
    });
    counts.designs++;
    const upload = await uploadAttachment(
      db,
      designer,
      designId,
      `hcn-${i}-datasheet.pdf`,
      datasheetBytes(options.attachmentKb, i),
    );
    if (!upload.ok) throw new Error(`attachment refused: ${upload.message}`);
    counts.attachments++;
    if (i % options.approveEvery === 0) {
      const submitted = await submitRevision(db, designer, { designId, number: 1 });
      if (!submitted.ok) throw new Error(`submit refused: ${submitted.message}`);
      const revision = await db
        .selectFrom("design_revisions")
        .select(["id", "result"])
        .where("design_id", "=", designId)
        .where("number", "=", 1)
        .executeTakeFirstOrThrow();
      const justifications = Object.fromEntries(
        rulesNeedingJustification(readChecks(revision.result)).map((rule) => [
          rule.rule,
          "Accepted for the generated load-test organisation.",
        ]),
      );
      const approved = await approveRevision(db, approver, {
        acknowledgeUnverifiedValues: true,
        designId,
        number: 1,
        comment: "",
        justifications,
      });
      if (!approved.ok) throw new Error(`approval refused: ${approved.message}`);
      counts.approved++;
      const exportId = await createExportFile(db, {
        organizationId: org.id,
        designId,
        revisionId: revision.id,
        kind: "spacing-sheet",
        options: { revisionNumber: 1, paper: "a4", units: "SI" },
        fileName: exportFileName({ equipmentTag, designName: name, designId }, 1, "spacing-sheet"),
        contentType: CONTENT_TYPES["spacing-sheet"],
        requestedBy: designer.userId,
      });
      await runSheetJob(db, exportId);
      const row = await db
        .selectFrom("export_files")
        .select(["status", "error"])
        .where("id", "=", exportId)
        .executeTakeFirstOrThrow();
      if (row.status !== "done") throw new Error(`sheet not rendered: ${row.error ?? row.status}`);
      counts.sheets++;
    }
    if (i % 100 === 0) log(`  ${i} designs`);
  }
  return counts;
}

async function main(): Promise<void> {
  const options = parseArgs(process.argv.slice(2));
  const { DATABASE_URL } = parseEnvKeys(["DATABASE_URL"]);
  const db = new Kysely<Database>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: DATABASE_URL, max: 2 }) }),
  });
  const started = performance.now();
  try {
    const made = await generateOrganisation(db, options, (line) => console.log(line));
    const seconds = ((performance.now() - started) / 1000).toFixed(1);
    console.log(
      `generated organisation ${made.organizationId}: ${made.designs} designs, ${made.attachments} attachments, ` +
        `${made.approved} approved revisions, ${made.sheets} spacing sheets in ${seconds} s`,
    );
  } finally {
    await db.destroy();
  }
}

if (process.argv[1] && /generate-org\.ts$/.test(process.argv[1])) {
  main().catch((error: unknown) => {
    console.error(`sealpitch: ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  });
}
