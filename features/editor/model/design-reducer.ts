import type { JointDesign } from "@/features/analysis/core/design";
import type { DesignAction } from "./editor-action";
import { addBolt } from "./add-bolt";
import { deleteBolts } from "./delete-bolt";
import { moveBolt, nudgeBolt } from "./move-bolt";
import { placeBoltsEqually } from "./place-bolts-equally";
import { renumberBolts } from "./renumber-bolts";
import { rotatePattern } from "./rotate-pattern";
import { setBoltCoordinates } from "./set-bolt-coordinates";
import { setField } from "./set-field";

/** Applies one design action. Returns the same object when nothing changed (history relies on it). */
export function designReducer(design: JointDesign, action: DesignAction): JointDesign {
  switch (action.type) {
    case "place-equally":
      return placeBoltsEqually(design, action.count, action.options);
    case "move-bolt":
      return moveBolt(design, action.boltId, { sMm: action.sMm, offPathMm: action.offPathMm });
    case "nudge-bolt":
      return nudgeBolt(design, action.boltId, action.deltaMm);
    case "set-bolt-coordinates":
      return setBoltCoordinates(design, action.boltId, action.edit);
    case "add-bolt":
      return addBolt(design, action.sMm).design;
    case "delete-bolts":
      return deleteBolts(design, action.boltIds);
    case "renumber":
      return renumberBolts(design).design;
    case "rotate-pattern":
      return rotatePattern(design, action.deltaMm);
    case "set-field":
      return setField(design, action.path, action.value);
    case "replace-design":
      return action.design;
  }
}
