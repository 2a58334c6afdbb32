"use client";

import useSWR from "swr";
import { fetchJson } from "@/features/ui/fetch-json";
import type { FeCheckResult, FeProgress, GasketPathSummary } from "../fe-check-result";

/** The latest FE cross-check of a revision as GET …/fe-check returns it. */
export interface FeCheckView {
  id: string;
  status: "queued" | "running" | "done" | "failed" | "cancelled";
  stage: string;
  progress: FeProgress;
  current: boolean;
  result: FeCheckResult | null;
  error: string | null;
  cancelRequested: boolean;
  requestedByName: string | null;
  createdAt: string;
  finishedAt: string | null;
}

const POLL_MS = 1000;

export function feCheckUrl(designId: string, revisionNumber: number): string {
  return `/api/v1/designs/${designId}/revisions/${revisionNumber}/fe-check`;
}

export const feCheckActive = (f: FeCheckView | null | undefined) =>
  !!f && (f.status === "queued" || f.status === "running");

/**
 * One SWR entry per revision, shared by the FE cross-check panel and the Layout desk's drawing
 * and Seat trace: polled every second while a run is queued or running, then left alone.
 */
export function useFeCheck(designId: string, revisionNumber: number) {
  const key = feCheckUrl(designId, revisionNumber);
  const { data, error, mutate } = useSWR<{ feCheck: FeCheckView | null }>(
    key,
    (url: string) => fetchJson(url, (s) => `The FE cross-check could not be read (HTTP ${s}).`),
    { refreshInterval: (latest) => (feCheckActive(latest?.feCheck) ? POLL_MS : 0) },
  );
  return {
    key,
    fe: data?.feCheck ?? null,
    loaded: data !== undefined,
    error: error as Error | undefined,
    mutate,
  };
}

/** The gasket path result to draw beside the estimate: a finished run of the saved document only. */
export function currentGasketPath(fe: FeCheckView | null): GasketPathSummary | null {
  if (!fe || fe.status !== "done" || !fe.current) return null;
  return fe.result?.gasketPath ?? null;
}
