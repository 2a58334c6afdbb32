"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import { CSV_COLUMNS } from "../model/csv-columns";
import type { LibraryKind } from "../model/dto";
import type { CsvFieldError, CsvImportMode, CsvImportPlan, CsvPreviewRow } from "../model/library-csv";

// CSV intake in three steps: choose a file and whether rows with a name already in the Stockroom
// are refused ("add new") or replace those rows ("update rows with the same name"); the server
// reads the file's bytes (delimiter, encoding, decimal commas), validates every row and says what
// will be added, updated or merged; only then the Confirm import button commits, all or nothing.
type Preview = {
  ok: boolean;
  message?: string;
  rows: CsvPreviewRow[];
  errors?: CsvFieldError[];
  count?: number;
  imported?: number;
  plan?: CsvImportPlan;
};

export function CsvImportPanel({ kind, endpoint }: { kind: LibraryKind; endpoint: string }) {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [mode, setMode] = useState<CsvImportMode>("add");
  const [preview, setPreview] = useState<Preview | null>(null);
  const [status, setStatus] = useState("");
  const [busy, setBusy] = useState(false);
  // Remounts the file input after a commit, so choosing the same file again is a new choice.
  const [inputKey, setInputKey] = useState(0);

  async function send(step: "preview" | "commit", body: File, m: CsvImportMode): Promise<Preview> {
    const res = await fetch(`${endpoint}?step=${step}&mode=${m}`, {
      method: "POST",
      headers: { "content-type": "text/csv" },
      body,
    });
    const json = await res.json();
    return json.error ? { ok: false, message: json.error.message, rows: [] } : json;
  }

  async function runPreview(f: File | null, m: CsvImportMode) {
    setPreview(null);
    setStatus("");
    if (!f) return;
    setBusy(true);
    const p = await send("preview", f, m);
    setBusy(false);
    setPreview(p);
    setStatus(p.ok ? (p.plan?.summary ?? "") : (p.message ?? "The file has problems."));
  }

  async function commit() {
    if (!file) return;
    setBusy(true);
    const r = await send("commit", file, mode);
    setBusy(false);
    setPreview(r);
    if (r.ok) {
      setStatus(
        `Imported from ${file.name}: ${r.plan?.added ?? 0} added, ${r.plan?.updated ?? 0} updated (${r.imported} Stockroom row(s)).`,
      );
      setFile(null);
      setInputKey((k) => k + 1);
      router.refresh();
    } else setStatus(r.message ?? "Nothing was imported.");
  }

  const actionOf = new Map<number, string>();
  for (const item of preview?.plan?.items ?? [])
    for (const line of item.lines)
      actionOf.set(
        line,
        item.lines.length > 1
          ? `${item.action} (merged with ${item.lines
              .filter((l) => l !== line)
              .map((l) => `row ${l}`)
              .join(", ")})`
          : item.action,
      );
  const columns = preview?.rows[0] ? Object.keys(preview.rows[0].cells) : CSV_COLUMNS[kind];
  const plan = preview?.ok ? preview.plan : undefined;
  return (
    <section
      className="flex flex-col gap-3 rounded-plate border border-ink-100 bg-steel-50 p-panel"
      aria-label="CSV intake"
    >
      <h2 className="text-lead font-semibold">CSV intake</h2>
      <p className="text-table text-ink-600">
        Columns: <span className="num">{CSV_COLUMNS[kind].join(", ")}</span>. Values in mm and MPa. Comma,
        semicolon or tab separated; UTF-8 or Windows-1252; with semicolons, decimal commas are read. One bad
        row and nothing is imported.
      </p>
      <fieldset
        className="flex flex-wrap gap-4 text-table"
        aria-label="Rows with a name already in the Stockroom"
      >
        <legend className="sr-only">Rows with a name already in the Stockroom</legend>
        {(
          [
            ["add", "Add new (refuse names already in the Stockroom)"],
            ["update", "Update rows with the same name"],
          ] as const
        ).map(([value, label]) => (
          <label key={value} className="flex items-center gap-1">
            <input
              type="radio"
              name={`csv-mode-${kind}`}
              value={value}
              checked={mode === value}
              onChange={() => {
                setMode(value);
                void runPreview(file, value);
              }}
            />
            {label}
          </label>
        ))}
      </fieldset>
      <label className="flex flex-col gap-1 text-table font-medium text-ink-800">
        CSV file
        <input
          key={inputKey}
          type="file"
          accept=".csv,text/csv"
          onChange={(e) => {
            const f = e.target.files?.[0] ?? null;
            setFile(f);
            void runPreview(f, mode);
          }}
          className="text-table"
        />
      </label>
      <p
        role="status"
        aria-live="polite"
        className={preview && !preview.ok ? "text-table text-verdict-fail" : "text-table text-verdict-pass"}
      >
        {busy ? "Working…" : status}
      </p>
      {preview && preview.rows.length > 0 ? (
        <div className="max-h-80 overflow-auto rounded-plate border border-ink-100 bg-white">
          <table className="w-full text-table" aria-label="CSV preview">
            <thead className="bg-steel-50 text-left">
              <tr>
                <th className="px-2 py-1">Row</th>
                {plan ? <th className="px-2 py-1">Will</th> : null}
                {columns.map((c) => (
                  <th key={c} className="px-2 py-1 font-medium">
                    {c}
                  </th>
                ))}
                <th className="px-2 py-1">Problems</th>
              </tr>
            </thead>
            <tbody>
              {preview.rows.map((r) => (
                <tr
                  key={r.line}
                  className={`border-t border-ink-100 ${r.errors.length ? "bg-verdict-fail-bg" : ""}`}
                >
                  <td className="num px-2 py-1">{r.line}</td>
                  {plan ? <td className="px-2 py-1">{actionOf.get(r.line) ?? ""}</td> : null}
                  {columns.map((c) => (
                    <td
                      key={c}
                      className={`px-2 py-1 ${r.errors.some((e) => e.field === c) ? "font-semibold text-verdict-fail" : ""}`}
                    >
                      {r.cells[c]}
                    </td>
                  ))}
                  <td className="px-2 py-1 text-verdict-fail">
                    {r.errors.map((e) => `${e.field}: ${e.message}`).join("; ")}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {plan && file ? (
        <button
          type="button"
          className={`${buttonStyles.primary} self-start`}
          onClick={commit}
          disabled={busy}
        >
          Confirm import: {plan.added} to add, {plan.updated} to update
        </button>
      ) : null}
    </section>
  );
}
