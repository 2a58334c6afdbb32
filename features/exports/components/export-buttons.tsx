"use client";

import { useState } from "react";
import useSWR from "swr";
import { buttonStyles } from "@/features/ui/button-styles";
import { fetchJson } from "@/features/ui/fetch-json";
import type { ActionResult } from "@/features/forms/action-result";
import {
  BACKGROUND_SHEET_MIN_BOLTS,
  JOB_POLL_MS,
  boltingKitUrl,
  drillingTemplateUrl,
  holeListUrl,
  jobStatusKey,
  passLogPdfUrl,
  passLogUrl,
  sheetPdfUrl,
} from "../cache-keys";

export interface ExportButtonsProps {
  designId: string;
  revisionNumber: number;
  /** Bolts in the revision's document: from BACKGROUND_SHEET_MIN_BOLTS (64) the sheet is queued. */
  boltCount: number;
  /** The viewer's unit system (users.unit_system); the sheet's default. */
  unitSystem: "SI" | "US";
  /** False when the revision has no stored result (the buttons are shown disabled). */
  hasResult?: boolean;
  /** The revision's last background sheet (shown unless it is done: still running, or failed with Retry sheet). */
  latestSheetJob?: JobStatus | null;
  /** The Retry sheet command (features/exports/actions.ts): queues a failed sheet again. */
  retrySheetAction?: (jobId: string) => Promise<ActionResult<{ jobId: string }>>;
}

export interface JobStatus {
  jobId: string;
  status: "queued" | "running" | "done" | "failed";
  progress: number;
  fileName: string;
  downloadUrl: string | null;
  error: string | null;
}

const fetchJob = (url: string) => fetchJson<JobStatus>(url, (status) => `HTTP ${status}`);

const PAPERS = [
  ["a4", "A4"],
  ["letter", "Letter"],
] as const;
const UNIT_SYSTEMS = [
  ["SI", "SI (mm, MPa, N·m)"],
  ["US", "US (in, psi, ft·lb)"],
] as const;

/** One of the files' choices (paper, units): a labelled select over `options` ([value, words]). */
function SheetChoice<T extends string>({
  label,
  value,
  onChange,
  options,
}: {
  label: string;
  value: T;
  onChange: (v: T) => void;
  options: readonly (readonly [T, string])[];
}) {
  return (
    <label className="flex flex-col text-micro text-ink-600">
      {label}
      <select
        className="rounded-plate border border-ink-200 px-2 py-1 text-table text-ink-900"
        value={value}
        onChange={(e) => onChange(e.target.value as T)}
      >
        {options.map(([v, words]) => (
          <option key={v} value={v}>
            {words}
          </option>
        ))}
      </select>
    </label>
  );
}

/** Sheet and Pass log (PDF), hole list (CSV), drilling template (DXF), Bolting kit and Pass log (CSV) of one stored revision. */
export function ExportButtons({
  designId,
  revisionNumber,
  boltCount,
  unitSystem,
  hasResult = true,
  latestSheetJob = null,
  retrySheetAction,
}: ExportButtonsProps) {
  const [paper, setPaper] = useState<"a4" | "letter">("a4");
  const [units, setUnits] = useState<"SI" | "US">(unitSystem);
  const resumed = latestSheetJob && latestSheetJob.status !== "done" ? latestSheetJob : null;
  const [jobId, setJobId] = useState<string | null>(resumed?.jobId ?? null);
  const [retrying, setRetrying] = useState(false);
  const [queueError, setQueueError] = useState<string | null>(null);
  const [queueing, setQueueing] = useState(false);
  const queued = boltCount >= BACKGROUND_SHEET_MIN_BOLTS;
  const {
    data: job,
    error: pollError,
    mutate: refreshJob,
  } = useSWR<JobStatus>(jobId ? jobStatusKey(jobId) : null, fetchJob, {
    fallbackData: resumed && jobId === resumed.jobId ? resumed : undefined,
    refreshInterval: (latest) =>
      latest && (latest.status === "done" || latest.status === "failed") ? 0 : JOB_POLL_MS,
  });
  const pdfUrl = sheetPdfUrl(designId, revisionNumber, paper, units);

  async function prepareSheet() {
    setQueueing(true);
    setQueueError(null);
    setJobId(null);
    try {
      const res = await fetch(pdfUrl, { method: "POST" });
      const body = (await res.json()) as { jobId?: string; error?: { message?: string } };
      if (res.status !== 202 || !body.jobId)
        throw new Error(body.error?.message ?? `The sheet could not be queued (HTTP ${res.status}).`);
      setJobId(body.jobId);
    } catch (e) {
      setQueueError(e instanceof Error ? e.message : String(e));
    } finally {
      setQueueing(false);
    }
  }

  async function retrySheet() {
    if (!jobId || !retrySheetAction) return;
    setRetrying(true);
    setQueueError(null);
    try {
      const res = await retrySheetAction(jobId);
      if (!res.ok) setQueueError(res.message);
      else await refreshJob();
    } catch (e) {
      setQueueError(e instanceof Error ? e.message : String(e));
    } finally {
      setRetrying(false);
    }
  }

  const disabled = !hasResult;
  const linkClass = (style: string) => `${style}${disabled ? " pointer-events-none opacity-50" : ""}`;
  const message =
    queueError ??
    pollError?.message ??
    (job?.status === "failed" ? (job.error ?? "The sheet could not be made.") : null);

  return (
    <section
      aria-label="Shop files"
      className="flex flex-col gap-2 rounded-plate border border-ink-200 bg-white p-3 shadow-plate"
    >
      <div className="flex flex-wrap items-end gap-3">
        <SheetChoice label="Paper" value={paper} onChange={setPaper} options={PAPERS} />
        <SheetChoice label="Units" value={units} onChange={setUnits} options={UNIT_SYSTEMS} />
        {queued ? (
          <button
            type="button"
            className={buttonStyles.primary}
            disabled={disabled || queueing || job?.status === "queued" || job?.status === "running"}
            onClick={prepareSheet}
          >
            {queueing ? "Queuing…" : "Prepare spacing sheet (PDF)"}
          </button>
        ) : (
          <a className={linkClass(buttonStyles.primary)} href={pdfUrl} aria-disabled={disabled} download>
            Spacing sheet (PDF)
          </a>
        )}
        {(
          [
            [(id: string, n: number) => passLogPdfUrl(id, n, paper, units), "Pass log (PDF)"],
            [holeListUrl, "Hole list (CSV)"],
            [drillingTemplateUrl, "Drilling template (DXF)"],
            [boltingKitUrl, "Bolting kit (CSV)"],
            [passLogUrl, "Pass log (CSV)"],
          ] as const
        ).map(([href, label]) => (
          <a
            key={label}
            className={linkClass(buttonStyles.secondary)}
            href={href(designId, revisionNumber)}
            aria-disabled={disabled}
            download
          >
            {label}
          </a>
        ))}
      </div>
      <div aria-live="polite" className="text-table text-ink-700">
        {queued && !jobId && !message ? (
          <p>{boltCount} bolts: the sheet is prepared in the background.</p>
        ) : null}
        {job && (job.status === "queued" || job.status === "running") ? (
          <div className="flex items-center gap-2">
            <progress className="h-2 w-48" max={100} value={job.progress} aria-label="Sheet progress" />
            <span className="num">
              {job.status === "queued" ? "Waiting in the queue…" : `Rendering ${job.progress} %`}
            </span>
          </div>
        ) : null}
        {job?.status === "done" && job.downloadUrl ? (
          <a className={buttonStyles.quiet} href={job.downloadUrl} download>
            Download {job.fileName}
          </a>
        ) : null}
        {message ? <p className="text-verdict-fail">{message}</p> : null}
        {job?.status === "failed" && retrySheetAction ? (
          <button type="button" className={buttonStyles.secondary} disabled={retrying} onClick={retrySheet}>
            {retrying ? "Queuing again…" : "Retry sheet"}
          </button>
        ) : null}
      </div>
    </section>
  );
}
