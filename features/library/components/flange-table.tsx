"use client";

import { createColumnHelper } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import type { FlangeTemplateChoiceDto } from "../model/dto";
import { CsvExportLinks } from "./csv-export-links";
import { CsvImportPanel } from "./csv-import-panel";
import { DataTable } from "./data-table";
import { FlangeForm } from "./flange-form";
import { OriginBadge } from "./origin-badge";
import { RowActions } from "./row-actions";

const col = createColumnHelper<FlangeTemplateChoiceDto>();
const mm = (v: number | null) => (v === null ? "—" : String(Math.round(v * 10) / 10));

export function FlangeTable({ rows, canEdit }: { rows: FlangeTemplateChoiceDto[]; canEdit: boolean }) {
  const [showForm, setShowForm] = useState(false);
  const columns = useMemo(
    () => [
      col.accessor("standard", { header: "Standard" }),
      col.accessor("pressureClass", { header: "Class / PN" }),
      col.accessor("size", {
        header: "Size",
        cell: (c) => <span className="font-medium text-ink-900">{c.getValue()}</span>,
      }),
      col.accessor("outsideDiameterMm", {
        header: "OD (mm)",
        cell: (c) => <span className="num">{mm(c.getValue())}</span>,
      }),
      col.accessor("boltCircleDiameterMm", {
        header: "Bolt circle (mm)",
        cell: (c) => <span className="num">{mm(c.getValue())}</span>,
      }),
      col.accessor("boltCount", {
        header: "Bolts",
        cell: (c) => <span className="num">{c.getValue()}</span>,
      }),
      col.accessor("boltDesignation", { header: "Bolt size" }),
      col.accessor("holeDiameterMm", {
        header: "Hole (mm)",
        cell: (c) => <span className="num">{mm(c.getValue())}</span>,
      }),
      col.accessor((f) => `${f.source}${f.edition ? ` (${f.edition})` : ""}`, {
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
                  kind="flange"
                  row={c.row.original}
                  label={`${c.row.original.standard} ${c.row.original.pressureClass} ${c.row.original.size}`}
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
      {canEdit && showForm ? <FlangeForm /> : null}
      <DataTable
        label="Flange templates"
        rows={rows}
        columns={columns}
        showHidden={canEdit}
        toolbar={
          <>
            {canEdit ? (
              <button type="button" className={buttonStyles.primary} onClick={() => setShowForm((s) => !s)}>
                {showForm ? "Close form" : "New flange template"}
              </button>
            ) : null}
            <CsvExportLinks endpoint="/api/v1/library/flanges/csv" />
          </>
        }
      />
      {canEdit ? <CsvImportPanel kind="flange" endpoint="/api/v1/library/flanges/csv" /> : null}
    </div>
  );
}
