/// <reference lib="webworker" />
// The Layout desk's core, off the page's thread: a module worker (bundled by Next from
// `new Worker(new URL(…), { type: "module" })`, nothing fetched from elsewhere) that imports
// only the core. Two uses (core-worker-protocol.ts):
// - the pattern search (use-pattern-search.ts): `suggestPatterns`, its progress after each
//   combination, then the result; Cancel terminates the worker, so the search never polls for it;
// - the live analysis (use-live-analysis.ts, analysis-channel.ts): the drag preview or the full
//   analysis of one document per request, its arrays transferred. The page sends the next
//   request only when this one has answered, and only the newest document (latest wins);
// - the heat map (grid-in-worker.ts): the full-area gasket-stress grid, its values transferred.
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { computeGasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
import { previewJoint } from "@/features/analysis/core/preview";
import { suggestPatterns } from "@/features/analysis/core/suggest/search";
import { validateJointDesign, type DesignIssue } from "@/features/analysis/core/validate";
import type {
  AnalyseWorkerReply,
  AnalyseWorkerRequest,
  CoreWorkerRequest,
  GridWorkerReply,
  GridWorkerRequest,
  SuggestWorkerReply,
} from "./core-worker-protocol";
import { packFull, packPreview } from "./preview-transfer";

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (m: SuggestWorkerReply) => scope.postMessage(m);

function suggest(request: CoreWorkerRequest & { type: "suggest" }) {
  try {
    const result = suggestPatterns(request.request, {
      onProgress: (p) => post({ type: "progress", ...p }),
    });
    post({ type: "done", result });
  } catch (error) {
    post({ type: "error", message: error instanceof Error ? error.message : String(error) });
  }
}

function refusal(design: AnalyseWorkerRequest["design"], err: unknown): DesignIssue[] {
  const issues = validateJointDesign(design);
  return issues.length > 0
    ? issues
    : [{ path: "design", message: err instanceof Error ? err.message : String(err) }];
}

function analyse({ seq, mode, design }: AnalyseWorkerRequest) {
  const t0 = performance.now();
  let reply: AnalyseWorkerReply;
  let transfer: ArrayBuffer[] = [];
  try {
    if (mode === "full") {
      // analyzeJoint validates first; the issues are listed only when it refuses.
      const packed = packFull(analyzeJoint(design));
      transfer = packed.transfer;
      reply = { type: "analysis", seq, ms: performance.now() - t0, ok: true, mode, full: packed.packed };
    } else {
      const packed = packPreview(previewJoint(design));
      transfer = packed.transfer;
      reply = { type: "analysis", seq, ms: performance.now() - t0, ok: true, mode, preview: packed.packed };
    }
  } catch (err) {
    reply = {
      type: "analysis",
      seq,
      ms: performance.now() - t0,
      ok: false,
      mode,
      issues: refusal(design, err),
    };
  }
  scope.postMessage(reply, transfer);
}

function grid({ seq, design, nx, ny }: GridWorkerRequest) {
  let reply: GridWorkerReply;
  try {
    reply = { type: "grid", seq, ok: true, grid: computeGasketStressGrid(design, nx, ny) };
  } catch (err) {
    reply = { type: "grid", seq, ok: false, message: err instanceof Error ? err.message : String(err) };
  }
  scope.postMessage(reply, reply.ok ? [reply.grid.values.buffer as ArrayBuffer] : []);
}

scope.onmessage = (event: MessageEvent<CoreWorkerRequest>) => {
  if (event.data.type === "analyse") analyse(event.data);
  else if (event.data.type === "grid") grid(event.data);
  else suggest(event.data);
};
