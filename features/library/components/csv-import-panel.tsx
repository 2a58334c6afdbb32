"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import { CSV_COLUMNS } from "../model/csv-columns";
import type { LibraryKind } from "../model/dto";
import type { CsvFieldError, CsvPreviewRow } from "../model/library-csv";

// CSV import in two steps: the server parses and validates the file and shows every row with
// its problems; only a clean file can be committed, and the commit is all-or-nothing.
type Preview = {
  ok: boolean;
  message?: string;
  rows: CsvPreviewRow[];
  errors?: CsvFieldError[];
  count?: number;
  imported?: number;
};

export function CsvImportPanel({ kind, endpoint }: { kind: LibraryKind; endpoint: string }) {
  const router = useRouter();
  const [text, setText] = useState<string | null>(null);
  const [fileName, setFileName] = useState("");
  const [preview, setPreview] = useState<Preview | null>(null);
  const [status, setStatus] = useState("");
  const [busy, setBusy] = useState(false);

  async function send(step: "preview" | "commit", body: string): Promise<Preview> {
    const res = await fetch(`${endpoint}?step=${step}`, {
      method: "POST",
      headers: { "content-type": "text/csv" },
      body,
    });
    const json = await res.json();
    return json.error ? { ok: false, message: json.error.message, rows: [] } : json;
  }

  async function onFile(file: File | undefined) {
    setPreview(null);
    setStatus("");
    if (!file) return;
    const body = await file.text();
    setText(body);
    setFileName(file.name);
    setBusy(true);
    const p = await send("preview", body);
    setBusy(false);
    setPreview(p);
    setStatus(
      p.ok ? `${p.count} row(s) ready to import from ${file.name}.` : (p.message ?? "The file has problems."),
    );
  }

  async function commit() {
    if (!text) return;
    setBusy(true);
    const r = await send("commit", text);
    setBusy(false);
    setPreview(r);
    if (r.ok) {
      setStatus(`Imported ${r.imported} row(s) from ${fileName}.`);
      setText(null);
      router.refresh();
    } else setStatus(r.message ?? "Nothing was imported.");
  }

  const columns = preview?.rows[0] ? Object.keys(preview.rows[0].cells) : CSV_COLUMNS[kind];
  return (
    <section
      className="flex flex-col gap-3 rounded-plate border border-ink-100 bg-steel-50 p-panel"
      aria-label="CSV intake"
    >
      <h2 className="text-lead font-semibold">CSV intake</h2>
      <p className="text-table text-ink-600">
        Columns: <span className="num">{CSV_COLUMNS[kind].join(", ")}</span>. Values in mm and MPa. One bad
        row and nothing is imported.
      </p>
      <label className="flex flex-col gap-1 text-table font-medium text-ink-800">
        CSV file
        <input
          type="file"
          accept=".csv,text/csv"
          onChange={(e) => onFile(e.target.files?.[0])}
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
      {preview?.ok && text ? (
        <button
          type="button"
          className={`${buttonStyles.primary} self-start`}
          onClick={commit}
          disabled={busy}
        >
          Import {preview.count} row(s)
        </button>
      ) : null}
    </section>
  );
}
