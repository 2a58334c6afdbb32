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

/** What every own row's DTO starts with: its ids, never hidden, and its source as the organisation's. */
function ownRow(r: { id: string; source: string; edition: string }) {
  return {
    id: `org:${r.id}`,
    origin: "organization" as const,
    rowId: r.id,
    hidden: false,
    source: r.source,
    edition: r.edition,
    confidence: "organisation" as const,
  };
}

export function toGasketDto(r: LibraryGasketRow): GasketChoiceDto {
  return {
    ...ownRow(r),
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
  };
}

export function toBoltingDto(r: LibraryBoltingRow): BoltingChoiceDto {
  return {
    ...ownRow(r),
    name: r.name,
    modulusMpa: r.modulus_mpa,
    ranges: r.ranges,
    allowableSource: r.ranges.some((x) => x.allowableMpa !== null) ? r.source : null,
  };
}

export function toFlangeDto(r: LibraryFlangeTemplateRow): FlangeTemplateChoiceDto {
  return {
    ...ownRow(r),
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

interface KindRow {
  gasket: GasketChoiceDto;
  bolting: BoltingChoiceDto;
  flange: FlangeTemplateChoiceDto;
}

const KIND_ROWS: {
  [K in LibraryKind]: {
    builtins: () => KindRow[K][];
    own: (db: Executor, organizationId: string) => Promise<KindRow[K][]>;
  };
} = {
  gasket: { builtins: builtinGaskets, own: listOwnGaskets },
  bolting: { builtins: builtinBolting, own: listOwnBolting },
  flange: { builtins: builtinFlangeTemplates, own: listOwnFlangeTemplates },
};

async function listKind<K extends LibraryKind>(
  db: Executor,
  organizationId: string,
  kind: K,
  includeHidden: boolean,
): Promise<KindRow[K][]> {
  const rows = KIND_ROWS[kind];
  return merge(
    rows.builtins(),
    await hiddenIds(db, organizationId, kind),
    await rows.own(db, organizationId),
    includeHidden,
  );
}

/** Gaskets a designer may pick: the organisation's own rows first, then visible built-ins. */
export const listGasketChoices = (db: Executor, organizationId: string) =>
  listKind(db, organizationId, "gasket", false);
export const listBoltingChoices = (db: Executor, organizationId: string) =>
  listKind(db, organizationId, "bolting", false);
export const listFlangeTemplateChoices = (db: Executor, organizationId: string) =>
  listKind(db, organizationId, "flange", false);

/** The Stockroom screen's rows: as the choices, with the hidden built-ins included and flagged. */
export const listGasketListing = (db: Executor, organizationId: string) =>
  listKind(db, organizationId, "gasket", true);
export const listBoltingListing = (db: Executor, organizationId: string) =>
  listKind(db, organizationId, "bolting", true);
export const listFlangeTemplateListing = (db: Executor, organizationId: string) =>
  listKind(db, organizationId, "flange", true);
