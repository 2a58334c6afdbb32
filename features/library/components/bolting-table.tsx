"use client";

import { createColumnHelper } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import type { BoltingChoiceDto, BoltingRangeJson } from "../model/dto";
import { BoltingForm } from "./bolting-form";
import { CsvExportLinks } from "./csv-export-links";
import { CsvImportPanel } from "./csv-import-panel";
import { DataTable } from "./data-table";
import { OriginBadge } from "./origin-badge";
import { RowActions } from "./row-actions";

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
      col.accessor("name", {
        header: "Material",
        cell: (c) => <span className="font-medium text-ink-900">{c.getValue()}</span>,
      }),
      col.accessor("modulusMpa", {
        header: "E (MPa)",
        cell: (c) => <span className="num">{c.getValue()}</span>,
      }),
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
      col.accessor((b) => `${b.source}${b.edition ? ` (${b.edition})` : ""}`, {
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
              cell: (c) => <RowActions kind="bolting" row={c.row.original} label={c.row.original.name} />,
            }),
          ]
        : []),
    ],
    [canEdit],
  );
  return (
    <div className="flex flex-col gap-6">
      {canEdit && showForm ? <BoltingForm /> : null}
      <DataTable
        label="Bolting materials"
        rows={rows}
        columns={columns}
        showHidden={canEdit}
        toolbar={
          <>
            {canEdit ? (
              <button type="button" className={buttonStyles.primary} onClick={() => setShowForm((s) => !s)}>
                {showForm ? "Close form" : "New bolting material"}
              </button>
            ) : null}
            <CsvExportLinks endpoint="/api/v1/library/bolting/csv" />
          </>
        }
      />
      {canEdit ? <CsvImportPanel kind="bolting" endpoint="/api/v1/library/bolting/csv" /> : null}
    </div>
  );
}
