import type { ColumnType, Generated, Selectable } from "kysely";
import type { Timestamp } from "./columns";

// Stockroom tables (organisation library rows, hidden built-ins) and design attachments with
// their blobs: migrations/2026_12_01_000700_create_library_and_attachments.ts.
// Insert may omit these (database default now()); reads are Dates.
type Json<T> = ColumnType<T, string, string>;

export type LeakageClass = "L1.0" | "L0.1" | "L0.01";
export type TightnessByClass = Partial<
  Record<LeakageClass, { qMinMpa: number | null; qsMinMpa: number | null }>
>;

export interface BoltingRangeJson {
  maxDiameterMm: number;
  proofMpa: number | null;
  yieldMpa: number;
  tensileMpa: number;
  allowableMpa: number | null;
}

export type LibraryKind = "gasket" | "bolting" | "flange";
export type AttachmentKind = "pdf" | "png" | "jpeg" | "dxf";

interface Stamped {
  created_by: string | null;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface LibraryGasketsTable extends Stamped {
  id: Generated<string>;
  organization_id: string;
  name: string;
  gasket_type: string;
  m: number;
  y_mpa: number;
  tightness: ColumnType<TightnessByClass, string | undefined, string>;
  qs_max_mpa: number | null;
  pqr: number | null;
  eg_mpa: number | null;
  modulus_mpa: number;
  thickness_mm: number;
  source: string;
  edition: Generated<string>;
}

export interface LibraryBoltingTable extends Stamped {
  id: Generated<string>;
  organization_id: string;
  name: string;
  modulus_mpa: number;
  ranges: Json<BoltingRangeJson[]>;
  source: string;
  edition: Generated<string>;
}

export interface LibraryFlangeTemplatesTable extends Stamped {
  id: Generated<string>;
  organization_id: string;
  standard: string;
  pressure_class: string;
  size: string;
  outside_diameter_mm: number;
  bore_diameter_mm: number | null;
  bolt_circle_diameter_mm: number;
  bolt_count: number;
  bolt_designation: string;
  bolt_diameter_mm: number;
  hole_diameter_mm: number;
  source: string;
  edition: Generated<string>;
}

export interface LibraryHiddenBuiltinsTable {
  organization_id: string;
  kind: LibraryKind;
  builtin_id: string;
  hidden_by: string | null;
  created_at: Timestamp;
}

export interface BlobsTable {
  id: Generated<string>;
  organization_id: string;
  bytes: Buffer;
  size_bytes: number;
  sha256: string;
  created_at: Timestamp;
}

export interface DesignAttachmentsTable {
  id: Generated<string>;
  organization_id: string;
  design_id: string;
  blob_id: string;
  file_name: string;
  kind: AttachmentKind;
  content_type: string;
  size_bytes: number;
  sha256: string;
  uploaded_by: string;
  created_at: Timestamp;
}

export type LibraryGasketRow = Selectable<LibraryGasketsTable>;
export type LibraryBoltingRow = Selectable<LibraryBoltingTable>;
export type LibraryFlangeTemplateRow = Selectable<LibraryFlangeTemplatesTable>;

export interface LibraryTables {
  library_gaskets: LibraryGasketsTable;
  library_bolting: LibraryBoltingTable;
  library_flange_templates: LibraryFlangeTemplatesTable;
  library_hidden_builtins: LibraryHiddenBuiltinsTable;
  blobs: BlobsTable;
  design_attachments: DesignAttachmentsTable;
}
