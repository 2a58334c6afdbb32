import type { JointDesign } from "@/features/analysis/core/design";
import type { CoordinateEdit } from "./set-bolt-coordinates";
import type { PlaceEquallyOptions } from "./place-bolts-equally";

/** Every change of the design document the editor can make. UI state (selection, zoom) is not here. */
export type DesignAction =
  | { type: "place-equally"; count: number; options?: PlaceEquallyOptions }
  /** `sMm`/`offPathMm` already resolved (snapped) by the canvas through resolveMoveTarget. */
  | { type: "move-bolt"; boltId: string; sMm: number; offPathMm: number }
  | { type: "nudge-bolt"; boltId: string; deltaMm: number }
  | { type: "set-bolt-coordinates"; boltId: string; edit: CoordinateEdit }
  | { type: "add-bolt"; sMm: number }
  | { type: "delete-bolts"; boltIds: string[] }
  | { type: "renumber" }
  | { type: "rotate-pattern"; deltaMm: number }
  | { type: "set-field"; path: string; value: unknown }
  | { type: "replace-design"; design: JointDesign };

/** History control around the design actions. */
export type HistoryAction =
  | DesignAction
  | { type: "undo" }
  | { type: "redo" }
  /** A drag begins: moves until drag-end are one history entry. */
  | { type: "drag-start" }
  | { type: "drag-end" }
  /** Start over from a document (load, "Reload theirs"): clears history. */
  | { type: "reset"; design: JointDesign };
