import type { JointDesign, UnitSystem } from "@/features/analysis/core/design";
import type { DesignAction } from "../model/editor-action";
import type { EditorChoices } from "../model/editor-choices";

/** What every section of the joint data form needs. */
export interface FormContext {
  design: JointDesign;
  units: UnitSystem;
  readOnly: boolean;
  /** The form's option lists from the catalogue, sent by the server page (no catalogue table on the client). */
  choices: EditorChoices;
  dispatch: (a: DesignAction) => void;
  /** Reports whether a field currently holds a value that was refused (blocks saving). */
  setInvalid: (path: string, invalid: boolean) => void;
  /** Messages from the server's or the schema's validation, by design path ("loads.designPressureMpa"). */
  errorFor: (path: string) => string | undefined;
}

export const fieldDomId = (path: string): string => `field-${path.replace(/[^A-Za-z0-9]/g, "-")}`;
