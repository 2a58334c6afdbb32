import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign, UnitSystem } from "@/features/analysis/core/design";
import type { RevisionStatus } from "@/db/tables/designs";
import type { FeCheckResult } from "@/features/fe-check/fe-check-result";

export type SheetPaper = "a4" | "letter";

export type SheetRevisionStatus = RevisionStatus;

/** An approved justification of a warn or fail check, shown under the check table. */
export interface SheetJustification {
  checkId: string;
  status: "warn" | "fail";
  text: string;
  /** Display name of the approver who accepted it. */
  by: string;
  /** ISO 8601. */
  at: string;
}

/** The FE cross-check printed on the sheet (absent: none, and the section is left out). */
export interface SheetFeCheck {
  result: FeCheckResult;
  resultHash: string;
  /** ISO 8601. */
  finishedAt: string;
  /** True when the revision's approval cites this run. */
  cited: boolean;
}

/**
 * Everything the spacing sheet shows. The route (or the background worker) reads it from the
 * stored revision: `result` is the stored JointAnalysis and is drawn as stored, never recomputed.
 */
export interface SheetInput {
  design: { name: string; equipmentTag: string };
  revision: {
    number: number;
    status: SheetRevisionStatus;
    designer: string;
    approver: string | null;
    /** ISO 8601. */
    approvedAt: string | null;
    contentHash: string | null;
    /** One sentence on the snapshot's hash check (printed under the editions), if known. */
    integrityNote?: string;
  };
  document: JointDesign;
  /** The stored JointAnalysis (null if none was stored); read defensively, it may be an older core's. */
  result: JointAnalysis | null;
  justifications: SheetJustification[];
  feCheck?: SheetFeCheck | null;
  paper: SheetPaper;
  units: UnitSystem;
  /** Written as the PDF creation and modification date: the only bytes that differ between downloads. */
  createdAt: Date;
}

export interface RenderOptions {
  /** Called with 0…1 as pages are laid out (the background job stores it as progress). */
  onProgress?: (fraction: number) => void | Promise<void>;
}
