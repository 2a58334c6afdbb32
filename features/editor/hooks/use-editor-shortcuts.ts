"use client";
import { useEffect } from "react";
import { useLatest } from "./use-latest";

export interface ShortcutHandlers {
  undo: () => void;
  redo: () => void;
  save: () => void;
  fit: () => void;
  deleteSelected: () => void;
  /** Nudge the selected bolt along the path by ±1 step (Shift: ±10). */
  nudge: (steps: number) => void;
}

function isTyping(t: EventTarget | null): boolean {
  const el = t as HTMLElement | null;
  return (
    !!el &&
    (el.tagName === "INPUT" || el.tagName === "TEXTAREA" || el.tagName === "SELECT" || el.isContentEditable)
  );
}

/** Keyboard shortcuts of the editor (listed in shortcut-help.tsx). Typing in a field is left alone, except Ctrl+S. */
export function useEditorShortcuts(handlers: ShortcutHandlers, enabled: boolean) {
  const h = useLatest(handlers);
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const mod = e.ctrlKey || e.metaKey;
      const key = e.key.toLowerCase();
      if (mod && key === "s") {
        e.preventDefault();
        (document.activeElement as HTMLElement | null)?.blur?.();
        // Let the blur commit the field first.
        window.setTimeout(() => h.current.save(), 0);
        return;
      }
      if (!enabled || isTyping(e.target)) return;
      if (mod && key === "z" && !e.shiftKey) {
        e.preventDefault();
        h.current.undo();
      } else if (mod && ((key === "z" && e.shiftKey) || key === "y")) {
        e.preventDefault();
        h.current.redo();
      } else if (!mod && key === "f") {
        e.preventDefault();
        h.current.fit();
      } else if (key === "delete" || key === "backspace") {
        e.preventDefault();
        h.current.deleteSelected();
      } else if (key === "arrowright" || key === "arrowup") {
        e.preventDefault();
        h.current.nudge(e.shiftKey ? 10 : 1);
      } else if (key === "arrowleft" || key === "arrowdown") {
        e.preventDefault();
        h.current.nudge(e.shiftKey ? -10 : -1);
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [enabled, h]);
}
