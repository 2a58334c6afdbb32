import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { LibraryKind, TightnessByClass } from "@/db/tables/library";
import { builtinBolting, builtinFlangeTemplates, builtinGaskets } from "./model/builtin-rows";
import type { BoltingChoiceDto, FlangeTemplateChoiceDto, GasketChoiceDto } from "./model/dto";
import {
  describeCsvError,
  parseLibraryCsv,
  type CsvFieldError,
  type CsvImportMode,
  type CsvImportPlan,
  type CsvPlanItem,
  type CsvPreviewRow,
} from "./model/library-csv";
import { toBoltingDto, toFlangeDto, toGasketDto, type Executor } from "./queries";
import type { BoltingInput, FlangeInput, GasketInput } from "./schema";

// Writes of the Stockroom. Callers have already checked canEditLibrary; every write is scoped to
// the organisation, so a row id of another organisation simply matches nothing.
export type WriteResult<T> =
  { ok: true; data: T } | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

function isUniqueViolation(err: unknown): boolean {
  return typeof err === "object" && err !== null && (err as { code?: string }).code === "23505";
}

function tightnessOf(i: GasketInput): TightnessByClass {
  const t: TightnessByClass = {};
  const put = (cls: keyof TightnessByClass, qMinMpa: number | null, qsMinMpa: number | null) => {
    if (qMinMpa !== null || qsMinMpa !== null) t[cls] = { qMinMpa, qsMinMpa };
  };
  put("L1.0", i.qmin_l1, i.qsmin_l1);
  put("L0.1", i.qmin_l01, i.qsmin_l01);
  put("L0.01", i.qmin_l001, i.qsmin_l001);
  return t;
}

function gasketValues(i: GasketInput) {
  return {
    name: i.name,
    gasket_type: i.gasket_type,
    m: i.m,
    y_mpa: i.y_mpa,
    tightness: JSON.stringify(tightnessOf(i)),
    qs_max_mpa: i.qsmax_mpa,
    pqr: i.pqr,
    eg_mpa: i.eg_mpa,
    modulus_mpa: i.modulus_mpa,
    thickness_mm: i.thickness_mm,
    source: i.source,
    edition: i.edition,
  };
}

function flangeValues(i: FlangeInput) {
  return {
    standard: i.standard,
    pressure_class: i.pressure_class,
    size: i.size,
    outside_diameter_mm: i.outside_diameter_mm,
    bore_diameter_mm: i.bore_diameter_mm,
    bolt_circle_diameter_mm: i.bolt_circle_diameter_mm,
    bolt_count: i.bolt_count,
    bolt_designation: i.bolt_designation,
    bolt_diameter_mm: i.bolt_diameter_mm,
    hole_diameter_mm: i.hole_diameter_mm,
    source: i.source,
    edition: i.edition,
  };
}

/** Bolting inputs are one size range each; inputs with the same name form one material. */
function boltingValues(ranges: BoltingInput[]) {
  const first = ranges[0];
  const sorted = [...ranges].sort((a, b) => a.max_diameter_mm - b.max_diameter_mm);
  return {
    name: first.name,
    modulus_mpa: first.modulus_mpa,
    source: first.source,
    edition: first.edition,
    ranges: JSON.stringify(
      sorted.map((r) => ({
        maxDiameterMm: r.max_diameter_mm,
        proofMpa: r.proof_mpa,
        yieldMpa: r.yield_mpa,
        tensileMpa: r.tensile_mpa,
        allowableMpa: r.allowable_mpa,
      })),
    ),
  };
}

const DUPLICATE = {
  gasket: { field: "name", message: "a gasket with this name is already in the Stockroom" },
  bolting: { field: "name", message: "a bolting material with this name is already in the Stockroom" },
  flange: {
    field: "size",
    message: "a template for this standard, class and size is already in the Stockroom",
  },
} as const;

async function guarded<T>(kind: LibraryKind, write: () => Promise<T>): Promise<WriteResult<T>> {
  try {
    return { ok: true, data: await write() };
  } catch (err) {
    if (!isUniqueViolation(err)) throw err;
    const d = DUPLICATE[kind];
    return { ok: false, message: `Not saved: ${d.message}.`, fieldErrors: { [d.field]: [d.message] } };
  }
}

export function createGasket(
  db: Executor,
  organizationId: string,
  userId: string,
  input: GasketInput,
): Promise<WriteResult<GasketChoiceDto>> {
  return guarded("gasket", async () =>
    toGasketDto(
      await db
        .insertInto("library_gaskets")
        .values({ organization_id: organizationId, created_by: userId, ...gasketValues(input) })
        .returningAll()
        .executeTakeFirstOrThrow(),
    ),
  );
}

export async function updateGasket(
  db: Executor,
  organizationId: string,
  rowId: string,
  input: GasketInput,
): Promise<WriteResult<GasketChoiceDto | null>> {
  return guarded("gasket", async () => {
    const row = await db
      .updateTable("library_gaskets")
      .set({ ...gasketValues(input), updated_at: new Date() })
      .where("organization_id", "=", organizationId)
      .where("id", "=", rowId)
      .returningAll()
      .executeTakeFirst();
    return row ? toGasketDto(row) : null;
  });
}

export function createBolting(
  db: Executor,
  organizationId: string,
  userId: string,
  ranges: BoltingInput[],
): Promise<WriteResult<BoltingChoiceDto>> {
  return guarded("bolting", async () =>
    toBoltingDto(
      await db
        .insertInto("library_bolting")
        .values({ organization_id: organizationId, created_by: userId, ...boltingValues(ranges) })
        .returningAll()
        .executeTakeFirstOrThrow(),
    ),
  );
}

export function createFlangeTemplate(
  db: Executor,
  organizationId: string,
  userId: string,
  input: FlangeInput,
): Promise<WriteResult<FlangeTemplateChoiceDto>> {
  return guarded("flange", async () =>
    toFlangeDto(
      await db
        .insertInto("library_flange_templates")
        .values({ organization_id: organizationId, created_by: userId, ...flangeValues(input) })
        .returningAll()
        .executeTakeFirstOrThrow(),
    ),
  );
}

const TABLES = {
  gasket: "library_gaskets",
  bolting: "library_bolting",
  flange: "library_flange_templates",
} as const;

export async function deleteLibraryRow(
  db: Executor,
  organizationId: string,
  kind: LibraryKind,
  rowId: string,
): Promise<boolean> {
  const r = await db
    .deleteFrom(TABLES[kind])
    .where("organization_id", "=", organizationId)
    .where("id", "=", rowId)
    .executeTakeFirst();
  return Number(r.numDeletedRows) > 0;
}

const BUILTIN_IDS: Record<LibraryKind, () => string[]> = {
  gasket: () => builtinGaskets().map((r) => r.rowId),
  bolting: () => builtinBolting().map((r) => r.rowId),
  flange: () => builtinFlangeTemplates().map((r) => r.rowId),
};

export async function setBuiltinHidden(
  db: Executor,
  organizationId: string,
  userId: string,
  kind: LibraryKind,
  builtinId: string,
  hidden: boolean,
): Promise<boolean> {
  if (!BUILTIN_IDS[kind]().includes(builtinId)) return false;
  if (hidden) {
    await db
      .insertInto("library_hidden_builtins")
      .values({ organization_id: organizationId, kind, builtin_id: builtinId, hidden_by: userId })
      .onConflict((oc) => oc.columns(["organization_id", "kind", "builtin_id"]).doNothing())
      .execute();
  } else {
    await db
      .deleteFrom("library_hidden_builtins")
      .where("organization_id", "=", organizationId)
      .where("kind", "=", kind)
      .where("builtin_id", "=", builtinId)
      .execute();
  }
  return true;
}

export type CsvImportResult =
  | { ok: true; imported: number; rows: CsvPreviewRow[]; plan: CsvImportPlan }
  | { ok: false; message: string; rows: CsvPreviewRow[]; errors: CsvFieldError[] };

type Parsed = Extract<ReturnType<typeof parseLibraryCsv>, { ok: true }>;

function rowKey(kind: LibraryKind, input: GasketInput | BoltingInput | FlangeInput): string {
  if (kind === "flange") {
    const f = input as FlangeInput;
    return `${f.standard}|${f.pressure_class}|${f.size}`.toLowerCase();
  }
  return (input as GasketInput | BoltingInput).name.toLowerCase();
}

function rowLabel(kind: LibraryKind, input: GasketInput | BoltingInput | FlangeInput): string {
  if (kind === "flange") {
    const f = input as FlangeInput;
    return `${f.standard} ${f.pressure_class} ${f.size}`;
  }
  return (input as GasketInput | BoltingInput).name;
}

async function existingKeys(
  db: Executor,
  organizationId: string,
  kind: LibraryKind,
): Promise<Map<string, string>> {
  if (kind === "flange") {
    const rows = await db
      .selectFrom("library_flange_templates")
      .select(["id", "standard", "pressure_class", "size"])
      .where("organization_id", "=", organizationId)
      .execute();
    return new Map(rows.map((r) => [`${r.standard}|${r.pressure_class}|${r.size}`.toLowerCase(), r.id]));
  }
  const rows = await db
    .selectFrom(kind === "gasket" ? "library_gaskets" : "library_bolting")
    .select(["id", "name"])
    .where("organization_id", "=", organizationId)
    .execute();
  return new Map(rows.map((r) => [r.name.toLowerCase(), r.id]));
}

const lineList = (lines: number[]) =>
  lines.length === 1
    ? `line ${lines[0]}`
    : `lines ${lines.slice(0, -1).join(", ")} and ${lines[lines.length - 1]}`;

/**
 * The preview's plan: which Stockroom rows the file adds, which it updates, and which bolting lines
 * merge into one material. In "add" mode a name already in the Stockroom is a row problem (the
 * preview shows it, so the commit never meets it first).
 */
export async function planLibraryImport(
  db: Executor,
  organizationId: string,
  kind: LibraryKind,
  parsed: Parsed,
  mode: CsvImportMode,
): Promise<
  | { ok: true; plan: CsvImportPlan; groups: { items: Parsed["inputs"]; rowId: string | null }[] }
  | { ok: false; message: string; rows: CsvPreviewRow[]; errors: CsvFieldError[] }
> {
  const existing = await existingKeys(db, organizationId, kind);
  const groups = new Map<string, Parsed["inputs"]>();
  for (const item of parsed.inputs) {
    const key = rowKey(kind, item.input);
    groups.set(key, [...(groups.get(key) ?? []), item]);
  }
  const errors: CsvFieldError[] = [];
  const out: { items: Parsed["inputs"]; rowId: string | null }[] = [];
  const items: CsvPlanItem[] = [];
  const merged: CsvImportPlan["merged"] = [];
  for (const [key, group] of groups) {
    const rowId = existing.get(key) ?? null;
    const label = rowLabel(kind, group[0].input);
    const lines = group.map((g) => g.line);
    if (rowId && mode === "add") {
      errors.push({
        line: lines[0],
        field: DUPLICATE[kind].field,
        message: `${DUPLICATE[kind].message}; choose "update rows with the same name" to replace it`,
      });
      continue;
    }
    out.push({ items: group, rowId });
    items.push({ label, lines, action: rowId ? "update" : "add" });
    if (group.length > 1) merged.push({ label, lines });
  }
  if (errors.length > 0) {
    const byLine = new Map(errors.map((e) => [e.line, e]));
    const rows = parsed.rows.map((r) => (byLine.has(r.line) ? { ...r, errors: [byLine.get(r.line)!] } : r));
    const more = errors.length > 1 ? ` (and ${errors.length - 1} more)` : "";
    return {
      ok: false,
      message: `${describeCsvError(errors[0])}${more}. Nothing was imported.`,
      rows,
      errors,
    };
  }
  const added = items.filter((i) => i.action === "add").length;
  const updated = items.length - added;
  const noun = { gasket: "gasket", bolting: "bolting material", flange: "flange template" }[kind];
  const parts = [`${added} ${noun}${added === 1 ? "" : "s"} to add`, `${updated} to update`];
  const mergeText = merged.map(
    (m) => `${lineList(m.lines)} (${m.label}) become 1 ${noun} with ${m.lines.length} size ranges`,
  );
  return {
    ok: true,
    groups: out,
    plan: {
      mode,
      format: parsed.format,
      added,
      updated,
      merged,
      items,
      summary: `${parsed.inputs.length} line${parsed.inputs.length === 1 ? "" : "s"} read (${parsed.format}): ${parts.join(", ")}${mergeText.length ? `; ${mergeText.join("; ")}` : ""}.`,
    },
  };
}

class RowRefused extends Error {
  constructor(readonly fieldError: CsvFieldError) {
    super(describeCsvError(fieldError));
  }
}

/**
 * Validates the whole file and plans it against the Stockroom, then writes every row in one
 * transaction: one bad row (invalid value, or in "add" mode a name already in the Stockroom) and
 * nothing is written. The message names the file line and the column.
 */
export async function importLibraryCsv(
  db: Executor,
  organizationId: string,
  userId: string,
  kind: LibraryKind,
  input: Uint8Array | string,
  mode: CsvImportMode = "add",
): Promise<CsvImportResult> {
  const parsed = parseLibraryCsv(kind, input);
  if (!parsed.ok) return parsed;
  const write = async (trx: Executor) => {
    const planned = await planLibraryImport(trx, organizationId, kind, parsed, mode);
    if (!planned.ok) return planned;
    for (const { items, rowId } of planned.groups) {
      const line = items[0].line;
      const values =
        kind === "bolting"
          ? boltingValues(items.map((x) => x.input as BoltingInput))
          : kind === "gasket"
            ? gasketValues(items[0].input as GasketInput)
            : flangeValues(items[0].input as FlangeInput);
      const table = TABLES[kind];
      try {
        if (rowId)
          await trx
            .updateTable(table)
            .set({ ...values, updated_at: new Date() } as never)
            .where("organization_id", "=", organizationId)
            .where("id", "=", rowId)
            .execute();
        else
          await trx
            .insertInto(table)
            .values({ organization_id: organizationId, created_by: userId, ...values } as never)
            .execute();
      } catch (err) {
        if (isUniqueViolation(err))
          throw new RowRefused({ line, field: DUPLICATE[kind].field, message: DUPLICATE[kind].message });
        throw err;
      }
    }
    return planned;
  };
  try {
    const planned = db.isTransaction
      ? await write(db)
      : await (db as Kysely<Database>).transaction().execute(write);
    if (!planned.ok) return planned;
    return { ok: true, imported: planned.groups.length, rows: parsed.rows, plan: planned.plan };
  } catch (err) {
    if (!(err instanceof RowRefused)) throw err;
    const rows = parsed.rows.map((r) =>
      r.line === err.fieldError.line ? { ...r, errors: [err.fieldError] } : r,
    );
    return { ok: false, message: `${err.message}. Nothing was imported.`, rows, errors: [err.fieldError] };
  }
}
