"use client";
import { useActionState } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import type { ActionResult } from "@/features/forms/action-result";

type RowAction<T> = (state: ActionResult<T> | null, formData: FormData) => Promise<ActionResult<T> | null>;

/** Duplicate and archive/restore buttons of one register row, each with its own status line. */
export function DesignRowActions({
  designId,
  name,
  archived,
  canDuplicate,
  canArchive,
  duplicateDesignAction,
  setDesignArchivedAction,
}: {
  designId: string;
  name: string;
  archived: boolean;
  canDuplicate: boolean;
  canArchive: boolean;
  duplicateDesignAction: RowAction<{ designId: string }>;
  setDesignArchivedAction: RowAction<{ archived: boolean }>;
}) {
  const [copyState, copy, copying] = useActionState(duplicateDesignAction, null);
  const [archiveState, archive, archiving] = useActionState(setDesignArchivedAction, null);
  const failure =
    copyState && !copyState.ok
      ? copyState.message
      : archiveState && !archiveState.ok
        ? archiveState.message
        : "";
  return (
    <div className="flex flex-wrap items-center justify-end gap-1">
      {canDuplicate ? (
        <form action={copy}>
          <input type="hidden" name="designId" value={designId} />
          <button
            type="submit"
            className={buttonStyles.quiet}
            disabled={copying}
            aria-label={`Duplicate ${name}`}
          >
            Duplicate
          </button>
        </form>
      ) : null}
      {canArchive ? (
        <form action={archive}>
          <input type="hidden" name="designId" value={designId} />
          <input type="hidden" name="archived" value={archived ? "false" : "true"} />
          <button
            type="submit"
            className={buttonStyles.quiet}
            disabled={archiving}
            aria-label={`${archived ? "Restore" : "Archive"} ${name}`}
          >
            {archived ? "Restore" : "Archive"}
          </button>
        </form>
      ) : null}
      <p role="status" aria-live="polite" className="w-full text-right text-micro text-verdict-fail">
        {failure}
      </p>
    </div>
  );
}
