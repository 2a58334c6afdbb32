"use client";

import { createColumnHelper } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import type { GasketChoiceDto } from "../model/dto";
import { CsvExportLinks } from "./csv-export-links";
import { CsvImportPanel } from "./csv-import-panel";
import { DataTable } from "./data-table";
import { GasketForm } from "./gasket-form";
import { OriginBadge } from "./origin-badge";
import { RowActions } from "./row-actions";

const col = createColumnHelper<GasketChoiceDto>();
const n = (v: number | null | undefined) =>
  v === null || v === undefined ? "—" : String(Math.round(v * 1000) / 1000);

function tightnessText(g: GasketChoiceDto): string {
  const parts = (["L1.0", "L0.1", "L0.01"] as const)
    .filter((c) => g.tightness[c])
    .map((c) => `${c}: ${n(g.tightness[c]?.qMinMpa)}/${n(g.tightness[c]?.qsMinMpa)}`);
  return parts.length ? parts.join(" · ") : "—";
}

export function GasketTable({ rows, canEdit }: { rows: GasketChoiceDto[]; canEdit: boolean }) {
  const [editing, setEditing] = useState<GasketChoiceDto | null>(null);
  const [showForm, setShowForm] = useState(false);
  const columns = useMemo(
    () => [
      col.accessor("name", {
        header: "Name",
        cell: (c) => <span className="font-medium text-ink-900">{c.getValue()}</span>,
      }),
      col.accessor("gasketType", { header: "Type" }),
      col.accessor("m", { header: "m", cell: (c) => <span className="num">{n(c.getValue())}</span> }),
      col.accessor("yMpa", {
        header: "y (MPa)",
        cell: (c) => <span className="num">{n(c.getValue())}</span>,
      }),
      col.accessor((g) => tightnessText(g), {
        id: "tightness",
        header: "Qmin/QSmin (MPa)",
        enableSorting: false,
        cell: (c) => <span className="num text-micro">{c.getValue()}</span>,
      }),
      col.accessor("qsMaxMpa", {
        header: "Qsmax",
        cell: (c) => <span className="num">{n(c.getValue())}</span>,
      }),
      col.accessor("modulusMpa", {
        header: "Modulus (MPa)",
        cell: (c) => <span className="num">{n(c.getValue())}</span>,
      }),
      col.accessor("thicknessMm", {
        header: "t (mm)",
        cell: (c) => <span className="num">{n(c.getValue())}</span>,
      }),
      col.accessor((g) => `${g.source}${g.edition ? ` (${g.edition})` : ""}`, {
        id: "source",
        header: "Source",
        cell: (c) => <span className="text-micro text-ink-600">{c.getValue()}</span>,
      }),
      col.accessor("confidence", {
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
                  kind="gasket"
                  row={c.row.original}
                  label={c.row.original.name}
                  onEdit={() => {
                    setEditing(c.row.original);
                    setShowForm(true);
                  }}
                />
              ),
            }),
          ]
        : []),
    ],
    [canEdit],
  );
  return (
    <div className="flex flex-col gap-6">
      {canEdit && showForm ? (
        <GasketForm
          key={editing?.id ?? "new"}
          editing={editing}
          onDone={
            editing
              ? () => {
                  setEditing(null);
                  setShowForm(false);
                }
              : undefined
          }
        />
      ) : null}
      <DataTable
        label="Gaskets"
        rows={rows}
        columns={columns}
        showHidden={canEdit}
        toolbar={
          <>
            {canEdit ? (
              <button
                type="button"
                className={buttonStyles.primary}
                onClick={() => {
                  setEditing(null);
                  setShowForm((s) => !s);
                }}
              >
                {showForm && !editing ? "Close form" : "New gasket"}
              </button>
            ) : null}
            <CsvExportLinks endpoint="/api/v1/library/gaskets/csv" />
          </>
        }
      />
      {canEdit ? <CsvImportPanel kind="gasket" endpoint="/api/v1/library/gaskets/csv" /> : null}
    </div>
  );
}
