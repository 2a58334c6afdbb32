import type { JointDesign } from "@/features/analysis/core/design";
import type { DesignAction, HistoryAction } from "./editor-action";

/** Undo/redo around the design document. Only design changes are recorded. */
export interface EditorHistory {
  past: JointDesign[];
  present: JointDesign;
  future: JointDesign[];
  /** The document when the current drag began; null when no drag is in progress. */
  dragBase: JointDesign | null;
}

/** Enough for a working day of edits without holding hundreds of 96-bolt copies. */
export const HISTORY_LIMIT = 200;

export function createHistory(design: JointDesign): EditorHistory {
  return { past: [], present: design, future: [], dragBase: null };
}

/**
 * Wraps a design reducer with history. Moves during a drag change `present` only; drag-end
 * records one entry (the document before the drag) if the drag changed anything.
 */
export function withHistory(reducer: (d: JointDesign, a: DesignAction) => JointDesign) {
  return function historyReducer(state: EditorHistory, action: HistoryAction): EditorHistory {
    switch (action.type) {
      case "undo": {
        if (state.dragBase || state.past.length === 0) return state;
        const prev = state.past[state.past.length - 1];
        return {
          ...state,
          past: state.past.slice(0, -1),
          present: prev,
          future: [state.present, ...state.future],
        };
      }
      case "redo": {
        if (state.dragBase || state.future.length === 0) return state;
        const [next, ...rest] = state.future;
        return { ...state, past: [...state.past, state.present], present: next, future: rest };
      }
      case "drag-start":
        return state.dragBase ? state : { ...state, dragBase: state.present };
      case "drag-end": {
        const base = state.dragBase;
        if (!base) return state;
        if (base === state.present) return { ...state, dragBase: null };
        return { past: trim([...state.past, base]), present: state.present, future: [], dragBase: null };
      }
      case "reset":
        return createHistory(action.design);
      default: {
        const next = reducer(state.present, action);
        if (next === state.present) return state;
        if (state.dragBase) return { ...state, present: next };
        return { past: trim([...state.past, state.present]), present: next, future: [], dragBase: null };
      }
    }
  };
}

function trim(past: JointDesign[]): JointDesign[] {
  return past.length > HISTORY_LIMIT ? past.slice(past.length - HISTORY_LIMIT) : past;
}

export const canUndo = (h: EditorHistory): boolean => h.past.length > 0 && !h.dragBase;
export const canRedo = (h: EditorHistory): boolean => h.future.length > 0 && !h.dragBase;
