"use client";

import type { CellContext, ColumnDef, ColumnHelper } from "@tanstack/react-table";
import type { ReactNode } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import type { LibraryKind, RowBase } from "../model/dto";
import { CsvExportLinks } from "./csv-export-links";
import { CsvImportPanel } from "./csv-import-panel";
import { DataTable } from "./data-table";
import { OriginBadge } from "./origin-badge";
import { RowActions } from "./row-actions";

const ENDPOINTS: Record<LibraryKind, string> = {
  gasket: "/api/v1/library/gaskets/csv",
  bolting: "/api/v1/library/bolting/csv",
  flange: "/api/v1/library/flanges/csv",
};

/** A number cell (tabular figures), written by `format`. */
export function numberCell<T, V>(format: (v: V) => ReactNode) {
  function NumberCell(c: CellContext<T, V>) {
    return <span className="num">{format(c.getValue())}</span>;
  }
  return NumberCell;
}

/** A row's name cell, in the table's strong ink. */
export function nameCell<T>(c: CellContext<T, string>) {
  return <span className="font-medium text-ink-900">{c.getValue()}</span>;
}

/**
 * The columns every Stockroom table ends with: source (and edition), origin, and for an admin the
 * row's commands (hide/show a built-in, delete or edit our own).
 */
export function closingColumns<T extends RowBase>(
  col: ColumnHelper<T>,
  kind: LibraryKind,
  canEdit: boolean,
  rowLabel: (row: T) => string,
  onEdit?: (row: T) => void,
) {
  return [
    col.accessor((r) => `${r.source}${r.edition ? ` (${r.edition})` : ""}`, {
      id: "source",
      header: "Source",
      cell: (c) => <span className="text-micro text-ink-600">{c.getValue()}</span>,
    }),
    col.accessor((r) => r.confidence, {
      id: "confidence",
      header: "Origin",
      cell: (c) => <OriginBadge confidence={c.getValue()} hidden={c.row.original.hidden} />,
    }),
    ...(canEdit
      ? [
          col.display({
            id: "actions",
            header: "",
            cell: (c) => (
              <RowActions
                kind={kind}
                row={c.row.original}
                label={rowLabel(c.row.original)}
                onEdit={onEdit ? () => onEdit(c.row.original) : undefined}
              />
            ),
          }),
        ]
      : []),
  ];
}

/**
 * One Stockroom section: the form when open, the table with its toolbar (the button that opens or
 * closes the form, the CSV export links) and, for an admin, the CSV intake.
 */
export function StockroomSection<T extends RowBase>({
  kind,
  label,
  rows,
  columns,
  canEdit,
  form,
  toggleLabel,
  onToggle,
}: {
  kind: LibraryKind;
  label: string;
  rows: T[];
  // TanStack's documented column type: each column's value type differs.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  columns: ColumnDef<T, any>[];
  canEdit: boolean;
  form: ReactNode;
  toggleLabel: string;
  onToggle: () => void;
}) {
  return (
    <div className="flex flex-col gap-6">
      {canEdit ? form : null}
      <DataTable
        label={label}
        rows={rows}
        columns={columns}
        showHidden={canEdit}
        toolbar={
          <>
            {canEdit ? (
              <button type="button" className={buttonStyles.primary} onClick={onToggle}>
                {toggleLabel}
              </button>
            ) : null}
            <CsvExportLinks endpoint={ENDPOINTS[kind]} />
          </>
        }
      />
      {canEdit ? <CsvImportPanel kind={kind} endpoint={ENDPOINTS[kind]} /> : null}
    </div>
  );
}
