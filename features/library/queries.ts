import "server-only";
import type { Executor } from "@/db/types";
import type {
  LibraryBoltingRow,
  LibraryFlangeTemplateRow,
  LibraryGasketRow,
  LibraryKind,
} from "@/db/tables/library";
import { builtinBolting, builtinFlangeTemplates, builtinGaskets } from "./model/builtin-rows";
import type { BoltingChoiceDto, FlangeTemplateChoiceDto, GasketChoiceDto } from "./model/dto";

// Reads of the Stockroom: built-in catalogue rows merged with the organisation's own rows.
// `list…Choices` is what a picker offers (built-in minus hidden, plus own rows);
// `list…Listing` is the Stockroom screen (hidden built-ins included, flagged).

async function hiddenIds(db: Executor, organizationId: string, kind: LibraryKind): Promise<Set<string>> {
  const rows = await db
    .selectFrom("library_hidden_builtins")
    .select("builtin_id")
    .where("organization_id", "=", organizationId)
    .where("kind", "=", kind)
    .execute();
  return new Set(rows.map((r) => r.builtin_id));
}

export function toGasketDto(r: LibraryGasketRow): GasketChoiceDto {
  return {
    id: `org:${r.id}`,
    origin: "organization",
    rowId: r.id,
    hidden: false,
    name: r.name,
    gasketType: r.gasket_type,
    m: r.m,
    yMpa: r.y_mpa,
    tightness: r.tightness ?? {},
    qsMaxMpa: r.qs_max_mpa,
    pqr: r.pqr,
    egMpa: r.eg_mpa,
    modulusMpa: r.modulus_mpa,
    thicknessMm: r.thickness_mm,
    source: r.source,
    edition: r.edition,
    confidence: "organisation",
  };
}

export function toBoltingDto(r: LibraryBoltingRow): BoltingChoiceDto {
  return {
    id: `org:${r.id}`,
    origin: "organization",
    rowId: r.id,
    hidden: false,
    name: r.name,
    modulusMpa: r.modulus_mpa,
    ranges: r.ranges,
    allowableSource: r.ranges.some((x) => x.allowableMpa !== null) ? r.source : null,
    source: r.source,
    edition: r.edition,
    confidence: "organisation",
  };
}

export function toFlangeDto(r: LibraryFlangeTemplateRow): FlangeTemplateChoiceDto {
  return {
    id: `org:${r.id}`,
    origin: "organization",
    rowId: r.id,
    hidden: false,
    standard: r.standard,
    pressureClass: r.pressure_class,
    size: r.size,
    outsideDiameterMm: r.outside_diameter_mm,
    boreDiameterMm: r.bore_diameter_mm,
    boltCircleDiameterMm: r.bolt_circle_diameter_mm,
    boltCount: r.bolt_count,
    boltDesignation: r.bolt_designation,
    boltDiameterMm: r.bolt_diameter_mm,
    holeDiameterMm: r.hole_diameter_mm,
    source: r.source,
    edition: r.edition,
    confidence: "organisation",
  };
}

function merge<T extends { rowId: string; hidden: boolean }>(
  builtins: T[],
  hidden: Set<string>,
  own: T[],
  includeHidden: boolean,
): T[] {
  const b = builtins
    .map((row) => ({ ...row, hidden: hidden.has(row.rowId) }))
    .filter((row) => includeHidden || !row.hidden);
  return [...own, ...b];
}

export async function listOwnGaskets(db: Executor, organizationId: string): Promise<GasketChoiceDto[]> {
  const rows = await db
    .selectFrom("library_gaskets")
    .selectAll()
    .where("organization_id", "=", organizationId)
    .orderBy("name")
    .execute();
  return rows.map(toGasketDto);
}

export async function listOwnBolting(db: Executor, organizationId: string): Promise<BoltingChoiceDto[]> {
  const rows = await db
    .selectFrom("library_bolting")
    .selectAll()
    .where("organization_id", "=", organizationId)
    .orderBy("name")
    .execute();
  return rows.map(toBoltingDto);
}

export async function listOwnFlangeTemplates(
  db: Executor,
  organizationId: string,
): Promise<FlangeTemplateChoiceDto[]> {
  const rows = await db
    .selectFrom("library_flange_templates")
    .selectAll()
    .where("organization_id", "=", organizationId)
    .orderBy("standard")
    .orderBy("pressure_class")
    .orderBy("outside_diameter_mm")
    .execute();
  return rows.map(toFlangeDto);
}

/** Gaskets a designer may pick: the organisation's own rows first, then visible built-ins. */
export async function listGasketChoices(db: Executor, organizationId: string): Promise<GasketChoiceDto[]> {
  return merge(
    builtinGaskets(),
    await hiddenIds(db, organizationId, "gasket"),
    await listOwnGaskets(db, organizationId),
    false,
  );
}

export async function listBoltingChoices(db: Executor, organizationId: string): Promise<BoltingChoiceDto[]> {
  return merge(
    builtinBolting(),
    await hiddenIds(db, organizationId, "bolting"),
    await listOwnBolting(db, organizationId),
    false,
  );
}

export async function listFlangeTemplateChoices(
  db: Executor,
  organizationId: string,
): Promise<FlangeTemplateChoiceDto[]> {
  return merge(
    builtinFlangeTemplates(),
    await hiddenIds(db, organizationId, "flange"),
    await listOwnFlangeTemplates(db, organizationId),
    false,
  );
}

export async function listGasketListing(db: Executor, organizationId: string): Promise<GasketChoiceDto[]> {
  return merge(
    builtinGaskets(),
    await hiddenIds(db, organizationId, "gasket"),
    await listOwnGaskets(db, organizationId),
    true,
  );
}

export async function listBoltingListing(db: Executor, organizationId: string): Promise<BoltingChoiceDto[]> {
  return merge(
    builtinBolting(),
    await hiddenIds(db, organizationId, "bolting"),
    await listOwnBolting(db, organizationId),
    true,
  );
}

export async function listFlangeTemplateListing(
  db: Executor,
  organizationId: string,
): Promise<FlangeTemplateChoiceDto[]> {
  return merge(
    builtinFlangeTemplates(),
    await hiddenIds(db, organizationId, "flange"),
    await listOwnFlangeTemplates(db, organizationId),
    true,
  );
}
