"use client";

import { useState } from "react";
import type { UnitSystem } from "@/features/analysis/core/design";
import { buttonStyles } from "@/features/ui/button-styles";
import { formatComparisonValue, formatDifference } from "../comparison-text";
import { FE_MODEL_NAMES, type FeCheckResult } from "../fe-check-result";
import { GasketPathChart, InterfacePressureChart } from "./fe-estimate-chart";
import { feCheckActive, useFeCheck, type FeCheckView } from "./use-fe-check";

// The FE cross-check panel of the Layout desk and the sign-off sheet: the "Run FE cross-check"
// command, the run's live progress with Cancel, and when done the estimate set against FE.

export interface FeCheckPanelProps {
  designId: string;
  revisionNumber: number;
  units: UnitSystem;
  /** Designers and approvers may run and cancel; others only read. */
  canRun: boolean;
  /** An approved revision keeps the run its approval cites: no new runs. */
  frozen: boolean;
}

async function post(url: string): Promise<void> {
  const res = await fetch(url, { method: "POST" });
  if (!res.ok) {
    const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new Error(body?.error?.message ?? `HTTP ${res.status}`);
  }
}

export function FeCheckPanel({ designId, revisionNumber, units, canRun, frozen }: FeCheckPanelProps) {
  const { key, fe, loaded, error, mutate } = useFeCheck(designId, revisionNumber);
  const [busy, setBusy] = useState(false);
  const [commandError, setCommandError] = useState<string | null>(null);

  async function run(url: string) {
    setBusy(true);
    setCommandError(null);
    try {
      await post(url);
      await mutate();
    } catch (e) {
      setCommandError(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  }

  const running = feCheckActive(fe);
  return (
    <section
      aria-labelledby="fe-check-heading"
      className="flex flex-col gap-3 rounded-plate bg-white p-4 shadow-plate"
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="fe-check-heading" className="text-lead font-semibold">
          FE cross-check
        </h2>
        {canRun && !frozen ? (
          <div className="flex gap-2">
            <button
              type="button"
              className={buttonStyles.primary}
              disabled={busy || running}
              onClick={() => run(key)}
            >
              Run FE cross-check
            </button>
            {running && fe ? (
              <button
                type="button"
                className={buttonStyles.secondary}
                disabled={busy || fe.cancelRequested}
                onClick={() => run(`/api/v1/fe-checks/${fe.id}/cancel`)}
              >
                {fe.cancelRequested ? "Cancelling…" : "Cancel run"}
              </button>
            ) : null}
          </div>
        ) : null}
      </div>
      <p className="text-table text-ink-700">
        Solves the saved revision {revisionNumber} with finite elements (CalculiX) on the server and sets the
        result beside the estimate.
        {frozen
          ? " This revision is approved: the run its approval cites is shown and no new run starts."
          : ""}
      </p>
      <div aria-live="polite" className="text-table text-ink-800">
        {commandError ? (
          <p role="alert" className="text-verdict-fail">
            {commandError}
          </p>
        ) : null}
        {error ? <p className="text-verdict-fail">{error.message}</p> : null}
        {!fe && loaded ? <p>No FE cross-check of this revision yet.</p> : null}
        {fe && running ? <RunProgress fe={fe} /> : null}
        {fe && (fe.status === "failed" || fe.status === "cancelled") ? (
          <p className={fe.status === "failed" ? "text-verdict-fail" : "text-ink-700"}>
            {fe.status === "failed" ? "The last run failed: " : "The last run was cancelled: "}
            {fe.error}
          </p>
        ) : null}
      </div>
      {fe?.status === "done" && fe.result ? <FeResult fe={fe} result={fe.result} units={units} /> : null}
    </section>
  );
}

function RunProgress({ fe }: { fe: FeCheckView }) {
  const p = fe.progress;
  return (
    <div className="flex flex-col gap-1" data-testid="fe-progress">
      <p>
        <strong>{fe.status === "queued" ? "Waiting for a worker" : fe.stage}</strong>
        {p.model ? ` — ${FE_MODEL_NAMES[p.model]}` : ""}
      </p>
      <p className="num text-ink-600">
        Mesh {p.elements.toLocaleString("en-GB")} elements · {p.runs} solver run{p.runs === 1 ? "" : "s"} ·{" "}
        {p.solverSeconds.toFixed(1)} s in the solver
      </p>
    </div>
  );
}

function FeResult({ fe, result, units }: { fe: FeCheckView; result: FeCheckResult; units: UnitSystem }) {
  return (
    <div className="flex flex-col gap-3">
      <p className="text-table text-ink-700">
        {fe.current ? "Of the saved document" : "Of an earlier save: the design changed since; run it again"}{" "}
        · finished{" "}
        {fe.finishedAt ? new Date(fe.finishedAt).toISOString().slice(0, 16).replace("T", " ") : "—"} UTC
        {fe.requestedByName ? ` · run by ${fe.requestedByName}` : ""} · {result.solverSeconds.toFixed(1)} s in
        the solver
      </p>
      <div className="overflow-x-auto">
        <table className="w-full text-table" aria-label="Estimate against FE">
          <thead>
            <tr className="text-left text-ink-600">
              <th className="py-1 pr-3 font-medium">Quantity</th>
              <th className="py-1 pr-3 font-medium">Estimate</th>
              <th className="py-1 pr-3 font-medium">FE</th>
              <th className="py-1 font-medium">FE vs estimate</th>
            </tr>
          </thead>
          <tbody>
            {result.comparison.map((row) => (
              <tr key={row.key} className="border-t border-ink-100">
                <td className="py-1 pr-3">
                  {row.quantity}
                  <span className="block text-micro text-ink-500">{row.note}</span>
                </td>
                <td className="num py-1 pr-3">{formatComparisonValue(row.unit, row.estimate, units)}</td>
                <td className="num py-1 pr-3">
                  {row.fe === null ? "not solved" : formatComparisonValue(row.unit, row.fe, units)}
                </td>
                <td className="num py-1">{formatDifference(row)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {result.stackError ? (
        <p className="text-table text-verdict-warn">Bolt stack: {result.stackError}</p>
      ) : null}
      {result.gasketPathError ? (
        <p className="text-table text-verdict-warn">Gasket path: {result.gasketPathError}</p>
      ) : null}
      {result.gasketPath?.warnings.map((w) => (
        <p key={w} className="text-table text-verdict-warn">
          Gasket path: {w}
        </p>
      ))}
      {result.gasketPath ? <GasketPathChart path={result.gasketPath} units={units} /> : null}
      {result.stack ? <InterfacePressureChart points={result.stack.pressure} units={units} /> : null}
      <details className="text-table text-ink-700">
        <summary className="cursor-pointer font-medium">Assumptions and cautions of this run</summary>
        <ul className="mt-1 list-disc space-y-1 pl-5">
          {result.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </details>
    </div>
  );
}
