"use client";
import { useCallback, useEffect, useRef, useState } from "react";
import type { SuggestionRequest } from "@/features/analysis/core/suggest/request";
import type { SuggestionProgress, SuggestionResult } from "@/features/analysis/core/suggest/search";
import type { SuggestWorkerReply, SuggestWorkerRequest } from "../workers/core-worker-protocol";
import { startCoreWorker } from "../workers/start-core-worker";

type PatternSearchState =
  | { status: "idle" }
  | { status: "running"; progress: SuggestionProgress | null }
  | { status: "done"; result: SuggestionResult }
  | { status: "cancelled" }
  | { status: "error"; message: string };

/**
 * Runs the pattern search in a module worker, one search at a time: `run` starts a fresh worker
 * (ending any search still running), progress arrives per combination, `cancel` terminates the
 * worker at once. The worker is ended when the dialog closes.
 */
export function usePatternSearch() {
  const [state, setState] = useState<PatternSearchState>({ status: "idle" });
  const worker = useRef<Worker | null>(null);

  const stop = useCallback(() => {
    worker.current?.terminate();
    worker.current = null;
  }, []);

  const run = useCallback(
    (request: SuggestionRequest) => {
      stop();
      const w = startCoreWorker();
      if (!w) {
        setState({ status: "error", message: "This browser could not start the search." });
        return;
      }
      worker.current = w;
      setState({ status: "running", progress: null });
      w.onmessage = (event: MessageEvent<SuggestWorkerReply>) => {
        if (worker.current !== w) return;
        const m = event.data;
        if (m.type === "progress") setState({ status: "running", progress: m });
        else {
          setState(
            m.type === "done"
              ? { status: "done", result: m.result }
              : { status: "error", message: m.message },
          );
          stop();
        }
      };
      w.onerror = (event) => {
        if (worker.current !== w) return;
        setState({ status: "error", message: event.message || "The search stopped unexpectedly." });
        stop();
      };
      w.postMessage({ type: "suggest", request } satisfies SuggestWorkerRequest);
    },
    [stop],
  );

  const cancel = useCallback(() => {
    if (!worker.current) return;
    stop();
    setState({ status: "cancelled" });
  }, [stop]);

  useEffect(() => stop, [stop]);
  return { state, run, cancel };
}
