// The interface between the designs data side (features/designs) and the editor canvas
// (features/editor). The design page loads a WorkspaceDesignDto and hands it, with the save and
// unit-system actions, to <DesignWorkspace />. Types only: importable from client and server.
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign, UnitSystem } from "@/features/analysis/core/design";
import type { ActionResult } from "@/features/forms/action-result";
import type { RevisionStatus } from "@/db/tables/designs";

export type { JointAnalysis };

export type WorkingRevisionStatus = RevisionStatus;

export interface WorkspaceDesignDto {
  designId: string;
  name: string;
  equipmentTag: string;
  revisionNumber: number;
  status: WorkingRevisionStatus;
  /** Optimistic-lock version of the working revision; send it back as `baseVersion`. */
  version: number;
  document: JointDesign;
  /** The stored, authoritative result of `document` (null only if it could not be computed). */
  result: JointAnalysis | null;
  /** Viewer is a designer and the working revision is draft or returned. */
  canEdit: boolean;
  ownerName: string;
  /** ISO 8601 time of the last save of the working revision. */
  updatedAt: string;
}

export interface SaveWorkingRevisionInput {
  designId: string;
  baseVersion: number;
  document: JointDesign;
  name?: string;
  equipmentTag?: string;
  /** The document's bolt pattern was applied from the Pattern finder: recorded in the design activity. */
  patternOrigin?: { suggestion: number; of: number };
}

/**
 * A refused stale save comes back as `{ ok: false, conflict: true, message: "This design was
 * changed by <name> at <time> (version N). …" }`; nothing is written, so the editor keeps its edits.
 * A frozen revision (in review / approved) is `{ ok: false, message }` without `conflict`.
 */
export type SaveWorkingRevisionResult =
  | Extract<ActionResult<{ version: number; result: JointAnalysis; savedAt: string }>, { ok: true }>
  | { ok: false; message: string; fieldErrors?: Record<string, string[]>; conflict?: true };

export type SaveWorkingRevisionAction = (
  input: SaveWorkingRevisionInput,
) => Promise<SaveWorkingRevisionResult>;

/** Remembers the viewer's unit system (users.unit_system). */
export type SetUnitSystemAction = (
  unitSystem: UnitSystem,
) => Promise<ActionResult<{ unitSystem: UnitSystem }>>;

export interface DesignWorkspaceProps {
  design: WorkspaceDesignDto;
  saveAction: SaveWorkingRevisionAction;
  unitSystem: UnitSystem;
  setUnitSystemAction: SetUnitSystemAction;
  /** Shows the revision without editing (default: editable when `design.canEdit`). */
  readOnly?: boolean;
}
