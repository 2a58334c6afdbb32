"use client";
import { buttonStyles } from "@/features/ui/button-styles";
import type { SaveState } from "../hooks/use-save";

const LABEL: Record<SaveState, string> = {
  saved: "Saved",
  unsaved: "Unsaved changes",
  saving: "Saving…",
  conflict: "Conflict",
  error: "Not saved",
};
const TONE: Record<SaveState, string> = {
  saved: "text-verdict-pass",
  unsaved: "text-verdict-warn",
  saving: "text-ink-600",
  conflict: "text-verdict-fail",
  error: "text-verdict-fail",
};

interface Props {
  state: SaveState;
  version: number;
  message: string | null;
  blockedReason: string | null;
  readOnly: boolean;
  onSave: () => void;
  onReloadTheirs: () => void;
}

/** Save button, the save state, and the conflict message with its way out ("Reload theirs"). */
export function SaveBar({ state, version, message, blockedReason, readOnly, onSave, onReloadTheirs }: Props) {
  return (
    <div className="flex flex-wrap items-center gap-2">
      <span
        role="status"
        aria-live="polite"
        data-testid="save-state"
        data-state={state}
        className={`text-table font-medium ${TONE[state]}`}
      >
        {LABEL[state]}
      </span>
      <span className="num text-micro text-ink-500" data-testid="design-version">
        v{version}
      </span>
      {!readOnly && (
        <button
          type="button"
          className={buttonStyles.primary}
          onClick={onSave}
          disabled={state === "saving" || state === "conflict"}
          title="Ctrl+S"
        >
          Save
        </button>
      )}
      <div aria-live="assertive" className="w-full empty:hidden">
        {blockedReason && state !== "conflict" && (
          <p className="text-micro text-verdict-warn">{blockedReason}</p>
        )}
        {message && (
          <div
            role="alert"
            className="mt-1 rounded-plate border border-verdict-fail bg-verdict-fail-bg p-2 text-table text-verdict-fail"
          >
            <p>{message}</p>
            {state === "conflict" && (
              <p className="mt-1 text-ink-800">
                Your edits are still on screen and were not written. Copy what you need, then{" "}
                <button type="button" className={buttonStyles.danger} onClick={onReloadTheirs}>
                  Reload theirs
                </button>
              </p>
            )}
          </div>
        )}
      </div>
    </div>
  );
}
