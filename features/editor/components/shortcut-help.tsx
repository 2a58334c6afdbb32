"use client";
import { useState } from "react";
import { toolButtonStyles } from "@/features/ui/button-styles";

export const SHORTCUTS: [string, string][] = [
  ["Drag a bolt", "move along the bolt path, snapping to equal pitch"],
  ["Alt or Shift + drag", "move freely, off the path"],
  ["Double-click the path", "add a bolt there"],
  ["Delete / Backspace", "remove the selected bolt"],
  ["← →", "nudge the selected bolt along the path (Shift: 10×)"],
  ["Ctrl+Z", "undo"],
  ["Ctrl+Shift+Z or Ctrl+Y", "redo"],
  ["Ctrl+S", "save now"],
  ["F", "fit the drawing"],
  ["Wheel", "zoom at the pointer"],
  ["Drag the background, or Space + drag", "pan"],
];

/** The "Keys" popover listing the editor's shortcuts. */
export function ShortcutHelp() {
  const [open, setOpen] = useState(false);
  return (
    <div className="relative">
      <button
        type="button"
        className={toolButtonStyles.quiet}
        aria-expanded={open}
        aria-controls="shortcut-help"
        onClick={() => setOpen((o) => !o)}
      >
        Keys
      </button>
      {open && (
        <div
          id="shortcut-help"
          role="dialog"
          aria-label="Keyboard shortcuts"
          className="absolute right-0 z-20 mt-1 w-80 rounded-plate bg-white p-3 text-table shadow-plate"
        >
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
            {SHORTCUTS.map(([k, v]) => (
              <div key={k} className="contents">
                <dt className="num font-medium text-ink-800">{k}</dt>
                <dd className="text-ink-600">{v}</dd>
              </div>
            ))}
          </dl>
        </div>
      )}
    </div>
  );
}
