import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { jointDesignSchema, formatDesignErrors } from "@/features/analysis/schema";
import { createDesign } from "@/features/designs/mutations";

// The example designs of the core (examples/*.json) as Joint register entries of the demo
// organisation, owned by Dana the designer. Idempotent: a design of the same name is left alone.
// Results are computed by the core through createDesign, exactly as a save would.
const OWNER_EMAIL = "dana.designer@kestrel-ridge.example";
const EXAMPLES_DIR = path.join(process.cwd(), "examples");

/** The equipment tag is the first tag-like word of the name (E-2107, V-3304). */
export function equipmentTagFromName(name: string): string {
  return /\b[A-Z]{1,3}-\d{3,5}\b/.exec(name)?.[0] ?? "";
}

export async function seedDesigns(
  db: Kysely<Database>,
  organizationId: string,
): Promise<{ created: string[] }> {
  const owner = await db
    .selectFrom("users")
    .select("id")
    .where("email", "=", OWNER_EMAIL)
    .executeTakeFirstOrThrow();
  const files = (await readdir(EXAMPLES_DIR)).filter((f) => f.endsWith(".json")).sort();
  const created: string[] = [];
  for (const file of files) {
    const parsed = jointDesignSchema.safeParse(
      JSON.parse(await readFile(path.join(EXAMPLES_DIR, file), "utf8")),
    );
    if (!parsed.success)
      throw new Error(
        `examples/${file} is not a valid design: ${formatDesignErrors(parsed.error).join("; ")}`,
      );
    const document = parsed.data as Parameters<typeof createDesign>[1]["document"];
    const exists = await db
      .selectFrom("designs")
      .select("id")
      .where("organization_id", "=", organizationId)
      .where("name", "=", document.name)
      .executeTakeFirst();
    if (exists) continue;
    await createDesign(db, {
      organizationId,
      ownerId: owner.id,
      name: document.name,
      equipmentTag: equipmentTagFromName(document.name),
      document,
    });
    created.push(document.name);
  }
  return { created };
}
