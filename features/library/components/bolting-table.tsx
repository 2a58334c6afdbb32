"use client";

import { createColumnHelper } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import type { BoltingChoiceDto, BoltingRangeJson } from "../model/dto";
import { BoltingForm } from "./bolting-form";
import { StockroomSection, closingColumns, nameCell, numberCell } from "./stockroom-section";

const col = createColumnHelper<BoltingChoiceDto>();
const n = (v: number | null) => (v === null ? "—" : String(Math.round(v * 10) / 10));

function Ranges({ ranges }: { ranges: BoltingRangeJson[] }) {
  return (
    <ul className="num text-micro">
      {ranges.map((r) => (
        <li key={r.maxDiameterMm}>
          ≤ {n(r.maxDiameterMm)} mm: Sp {n(r.proofMpa)} · Sy {n(r.yieldMpa)} · Su {n(r.tensileMpa)} · S{" "}
          {n(r.allowableMpa)}
        </li>
      ))}
    </ul>
  );
}

export function BoltingTable({ rows, canEdit }: { rows: BoltingChoiceDto[]; canEdit: boolean }) {
  const [showForm, setShowForm] = useState(false);
  const columns = useMemo(
    () => [
      col.accessor("name", { header: "Material", cell: nameCell }),
      col.accessor("modulusMpa", { header: "E (MPa)", cell: numberCell((v: number) => v) }),
      col.accessor((b) => b.ranges.map((r) => r.maxDiameterMm).join(" "), {
        id: "ranges",
        header: "Strengths by size (MPa)",
        enableSorting: false,
        cell: (c) => <Ranges ranges={c.row.original.ranges} />,
      }),
      col.accessor((b) => b.ranges[0]?.allowableMpa ?? -1, {
        id: "allowable",
        header: "Allowable S",
        cell: (c) => <span className="num">{n(c.row.original.ranges[0]?.allowableMpa ?? null)}</span>,
      }),
      ...closingColumns(col, "bolting", canEdit, (b) => b.name),
    ],
    [canEdit],
  );
  return (
    <StockroomSection
      kind="bolting"
      label="Bolting materials"
      rows={rows}
      columns={columns}
      canEdit={canEdit}
      form={showForm ? <BoltingForm /> : null}
      toggleLabel={showForm ? "Close form" : "New bolting material"}
      onToggle={() => setShowForm((s) => !s)}
    />
  );
}
