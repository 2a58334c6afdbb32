"use client";
import { useCallback, useReducer } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import { designReducer } from "../model/design-reducer";
import type { HistoryAction } from "../model/editor-action";
import { canRedo, canUndo, createHistory, withHistory } from "../model/history";

const historyReducer = withHistory(designReducer);

/** The editor document with undo/redo (model/history.ts) as React state. */
export function useEditorHistory(initial: JointDesign) {
  const [history, dispatch] = useReducer(historyReducer, initial, createHistory);
  const undo = useCallback(() => dispatch({ type: "undo" }), []);
  const redo = useCallback(() => dispatch({ type: "redo" }), []);
  return {
    design: history.present,
    dragging: history.dragBase !== null,
    dispatch: dispatch as (a: HistoryAction) => void,
    undo,
    redo,
    canUndo: canUndo(history),
    canRedo: canRedo(history),
  };
}
