"use client";

import { createColumnHelper } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import type { FlangeTemplateChoiceDto } from "../model/dto";
import { FlangeForm } from "./flange-form";
import { StockroomSection, closingColumns, nameCell, numberCell } from "./stockroom-section";

const col = createColumnHelper<FlangeTemplateChoiceDto>();
const mm = numberCell<FlangeTemplateChoiceDto, number | null>((v) =>
  v === null ? "—" : String(Math.round(v * 10) / 10),
);

export function FlangeTable({ rows, canEdit }: { rows: FlangeTemplateChoiceDto[]; canEdit: boolean }) {
  const [showForm, setShowForm] = useState(false);
  const columns = useMemo(
    () => [
      col.accessor("standard", { header: "Standard" }),
      col.accessor("pressureClass", { header: "Class / PN" }),
      col.accessor("size", { header: "Size", cell: nameCell }),
      col.accessor("outsideDiameterMm", { header: "OD (mm)", cell: mm }),
      col.accessor("boltCircleDiameterMm", { header: "Bolt circle (mm)", cell: mm }),
      col.accessor("boltCount", { header: "Bolts", cell: numberCell((v: number) => v) }),
      col.accessor("boltDesignation", { header: "Bolt size" }),
      col.accessor("holeDiameterMm", { header: "Hole (mm)", cell: mm }),
      ...closingColumns(col, "flange", canEdit, (f) => `${f.standard} ${f.pressureClass} ${f.size}`),
    ],
    [canEdit],
  );
  return (
    <StockroomSection
      kind="flange"
      label="Flange templates"
      rows={rows}
      columns={columns}
      canEdit={canEdit}
      form={showForm ? <FlangeForm /> : null}
      toggleLabel={showForm ? "Close form" : "New flange template"}
      onToggle={() => setShowForm((s) => !s)}
    />
  );
}
