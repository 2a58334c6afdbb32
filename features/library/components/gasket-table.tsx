"use client";

import { createColumnHelper } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import type { GasketChoiceDto } from "../model/dto";
import { GasketForm } from "./gasket-form";
import { StockroomSection, closingColumns, nameCell, numberCell } from "./stockroom-section";

const col = createColumnHelper<GasketChoiceDto>();
const n = (v: number | null | undefined) =>
  v === null || v === undefined ? "—" : String(Math.round(v * 1000) / 1000);
const num = numberCell<GasketChoiceDto, number | null>(n);

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
      col.accessor("name", { header: "Name", cell: nameCell }),
      col.accessor("gasketType", { header: "Type" }),
      col.accessor("m", { header: "m", cell: num }),
      col.accessor("yMpa", { header: "y (MPa)", cell: num }),
      col.accessor((g) => tightnessText(g), {
        id: "tightness",
        header: "Qmin/QSmin (MPa)",
        enableSorting: false,
        cell: (c) => <span className="num text-micro">{c.getValue()}</span>,
      }),
      col.accessor("qsMaxMpa", { header: "Qsmax", cell: num }),
      col.accessor("modulusMpa", { header: "Modulus (MPa)", cell: num }),
      col.accessor("thicknessMm", { header: "t (mm)", cell: num }),
      ...closingColumns(
        col,
        "gasket",
        canEdit,
        (g) => g.name,
        (g) => {
          setEditing(g);
          setShowForm(true);
        },
      ),
    ],
    [canEdit],
  );
  return (
    <StockroomSection
      kind="gasket"
      label="Gaskets"
      rows={rows}
      columns={columns}
      canEdit={canEdit}
      form={
        showForm ? (
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
        ) : null
      }
      toggleLabel={showForm && !editing ? "Close form" : "New gasket"}
      onToggle={() => {
        setEditing(null);
        setShowForm((s) => !s);
      }}
    />
  );
}
