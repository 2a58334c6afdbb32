"use client";
import { useState } from "react";
import { toolButtonStyles } from "@/features/ui/button-styles";
import { MAX_BOLT_COUNT } from "@/features/analysis/core/design";
import { ShortcutHelp } from "./shortcut-help";

interface Props {
  boltCount: number;
  readOnly: boolean;
  canUndo: boolean;
  canRedo: boolean;
  onPlace: (count: number, onCentreLines: boolean) => void;
  onRotate: (degrees: number) => void;
  onRenumber: () => void;
  onUndo: () => void;
  onRedo: () => void;
  onFit: () => void;
  /** Opens the Pattern finder. */
  onSuggest: () => void;
}

/** The "Pattern bench" above the drawing: place N equally, rotate, renumber, Suggest pattern, undo/redo, fit. */
export function PatternToolbar(p: Props) {
  const [count, setCount] = useState(String(p.boltCount));
  const [rotate, setRotate] = useState("5");
  const [straddle, setStraddle] = useState(true);
  const [error, setError] = useState<string | null>(null);
  const place = () => {
    const n = Number(count);
    if (!/^\d+$/.test(count.trim()) || n < 1 || n > MAX_BOLT_COUNT) {
      setError(`Bolt count must be a whole number from 1 to ${MAX_BOLT_COUNT}.`);
      return;
    }
    setError(null);
    p.onPlace(n, !straddle);
  };
  const rot = (sign: number) => {
    const d = Number(rotate);
    if (!Number.isFinite(d) || rotate.trim() === "" || Math.abs(d) > 360) {
      setError("Rotation must be a number of degrees between −360 and 360.");
      return;
    }
    setError(null);
    p.onRotate(sign * d);
  };
  return (
    <div
      role="toolbar"
      aria-label="Pattern bench"
      className="flex flex-wrap items-end gap-x-1.5 gap-y-2 border-b border-ink-100 bg-steel-50 px-3 py-2 text-table"
    >
      {!p.readOnly && (
        <>
          <label className="flex flex-col">
            <span className="text-micro text-ink-600">Bolts</span>
            <input
              aria-label="Bolts to place"
              aria-describedby={error ? "pattern-error" : undefined}
              aria-invalid={!!error}
              className="num w-16 rounded border border-ink-200 px-1.5 py-1"
              value={count}
              onChange={(e) => setCount(e.target.value)}
              onKeyDown={(e) => e.key === "Enter" && place()}
            />
          </label>
          <label className="flex items-center gap-1 pb-1.5 text-micro">
            <input type="checkbox" checked={straddle} onChange={(e) => setStraddle(e.target.checked)} />{" "}
            straddle centre lines
          </label>
          <button type="button" className={toolButtonStyles.secondary} onClick={place}>
            Place equally
          </button>
          <label className="flex flex-col">
            <span className="text-micro text-ink-600">Turn, °</span>
            <input
              aria-label="Turn pattern by degrees"
              className="num w-14 rounded border border-ink-200 px-1.5 py-1"
              value={rotate}
              onChange={(e) => setRotate(e.target.value)}
            />
          </label>
          <button
            type="button"
            className={toolButtonStyles.quiet}
            aria-label="Turn pattern anticlockwise"
            onClick={() => rot(-1)}
          >
            ⟲
          </button>
          <button
            type="button"
            className={toolButtonStyles.quiet}
            aria-label="Turn pattern clockwise"
            onClick={() => rot(1)}
          >
            ⟳
          </button>
          <button type="button" className={toolButtonStyles.quiet} onClick={p.onRenumber}>
            Renumber
          </button>
          <button type="button" className={toolButtonStyles.secondary} onClick={p.onSuggest}>
            Suggest pattern
          </button>
          <span className="mx-1 h-6 w-px bg-ink-200" />
          <button type="button" className={toolButtonStyles.quiet} disabled={!p.canUndo} onClick={p.onUndo}>
            Undo
          </button>
          <button type="button" className={toolButtonStyles.quiet} disabled={!p.canRedo} onClick={p.onRedo}>
            Redo
          </button>
        </>
      )}
      <button type="button" className={toolButtonStyles.quiet} onClick={p.onFit}>
        Fit
      </button>
      <div className="ml-auto">
        <ShortcutHelp />
      </div>
      {error && (
        <p id="pattern-error" role="alert" className="w-full text-micro text-verdict-fail">
          {error}
        </p>
      )}
    </div>
  );
}
