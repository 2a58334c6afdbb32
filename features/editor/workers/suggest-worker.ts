/// <reference lib="webworker" />
// The Layout desk's pattern search, off the page's thread: a module worker (bundled by Next from
// `new Worker(new URL(…), { type: "module" })` in use-pattern-search.ts) that runs the core's
// `suggestPatterns` and posts its progress after each combination, then the result. Cancel
// terminates the worker, so the search never has to poll for it. Imports only the core.
import { suggestPatterns } from "@/features/analysis/core/suggest/search";
import type { SuggestWorkerReply, SuggestWorkerRequest } from "./suggest-protocol";

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (m: SuggestWorkerReply) => scope.postMessage(m);

scope.onmessage = (event: MessageEvent<SuggestWorkerRequest>) => {
  try {
    const result = suggestPatterns(event.data.request, {
      onProgress: (p) => post({ type: "progress", ...p }),
    });
    post({ type: "done", result });
  } catch (error) {
    post({ type: "error", message: error instanceof Error ? error.message : String(error) });
  }
};
