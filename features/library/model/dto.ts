// What the Stockroom hands to screens and to other features (types only: safe on the client).
// Built-in rows come from features/analysis/core/catalogue and carry its confidence tag; an
// organisation's own rows carry "organisation". Ids are prefixed so one id names one row.
import type { Confidence } from "@/features/analysis/core/catalogue/confidence";
import type { BoltingRangeJson, LeakageClass, LibraryKind, TightnessByClass } from "@/db/tables/library";

export type { BoltingRangeJson, LeakageClass, LibraryKind, TightnessByClass };
export const LEAKAGE_CLASSES: readonly LeakageClass[] = ["L1.0", "L0.1", "L0.01"];

export type RowOrigin = "builtin" | "organization";
export type RowConfidence = Confidence | "organisation";

export interface RowBase {
  /** "builtin:<catalogue id>" or "org:<uuid>". */
  id: string;
  origin: RowOrigin;
  /** The catalogue id or the database uuid, without prefix. */
  rowId: string;
  source: string;
  edition: string;
  confidence: RowConfidence;
  /** Only in full listings (the Stockroom screen): a built-in row this organisation hid. */
  hidden: boolean;
}

export interface GasketChoiceDto extends RowBase {
  name: string;
  gasketType: string;
  m: number;
  yMpa: number;
  tightness: TightnessByClass;
  qsMaxMpa: number | null;
  pqr: number | null;
  egMpa: number | null;
  modulusMpa: number;
  thicknessMm: number;
}

export interface BoltingChoiceDto extends RowBase {
  name: string;
  modulusMpa: number;
  ranges: BoltingRangeJson[];
  allowableSource: string | null;
}

export interface FlangeTemplateChoiceDto extends RowBase {
  standard: string;
  pressureClass: string;
  size: string;
  outsideDiameterMm: number;
  boreDiameterMm: number | null;
  boltCircleDiameterMm: number;
  boltCount: number;
  boltDesignation: string;
  boltDiameterMm: number;
  holeDiameterMm: number;
}
