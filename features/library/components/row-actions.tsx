"use client";

import { deleteLibraryRowAction, setBuiltinHiddenAction } from "../actions";
import type { LibraryKind } from "../model/dto";

// Admin controls of one row: hide/show a built-in row, or delete one of our own rows.
export function RowActions({
  kind,
  row,
  label,
  onEdit,
}: {
  kind: LibraryKind;
  row: { origin: string; rowId: string; hidden: boolean };
  label: string;
  onEdit?: () => void;
}) {
  if (row.origin === "builtin") {
    return (
      <form action={setBuiltinHiddenAction}>
        <input type="hidden" name="kind" value={kind} />
        <input type="hidden" name="builtinId" value={row.rowId} />
        <input type="hidden" name="hidden" value={row.hidden ? "false" : "true"} />
        <button
          type="submit"
          className="text-table text-ink-600 underline-offset-2 hover:underline"
          aria-label={`${row.hidden ? "Show" : "Hide"} ${label}`}
        >
          {row.hidden ? "Show" : "Hide"}
        </button>
      </form>
    );
  }
  return (
    <div className="flex gap-3">
      {onEdit ? (
        <button
          type="button"
          onClick={onEdit}
          className="text-table text-ink-700 underline-offset-2 hover:underline"
          aria-label={`Edit ${label}`}
        >
          Edit
        </button>
      ) : null}
      <form
        action={deleteLibraryRowAction}
        onSubmit={(e) => {
          if (
            !window.confirm(`Remove “${label}” from the Stockroom? Designs that used it keep their own copy.`)
          )
            e.preventDefault();
        }}
      >
        <input type="hidden" name="kind" value={kind} />
        <input type="hidden" name="id" value={row.rowId} />
        <button
          type="submit"
          className="text-table text-verdict-fail underline-offset-2 hover:underline"
          aria-label={`Remove ${label}`}
        >
          Remove
        </button>
      </form>
    </div>
  );
}
