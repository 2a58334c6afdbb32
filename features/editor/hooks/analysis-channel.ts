"use client";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import type { JointPreview } from "@/features/analysis/core/preview";
import type { DesignIssue } from "@/features/analysis/core/validate";
import type { AnalyseWorkerReply, AnalyseWorkerRequest } from "../workers/core-worker-protocol";
import { unpackFull, unpackPreview } from "../workers/preview-transfer";
import { startCoreWorker } from "../workers/start-core-worker";

/** What the worker gave for one document (the very object that was sent). */
export type ChannelReply = { design: JointDesign; workerMs: number } & (
  | { mode: "preview"; preview: JointPreview; issues: null }
  | { mode: "full"; full: JointAnalysis; issues: null }
  | { mode: "preview" | "full"; issues: DesignIssue[] }
);

interface Job {
  seq: number;
  mode: "preview" | "full";
  design: JointDesign;
  /** A warm-up run (hooks/use-core-warmup.ts): its answer is not passed on. */
  warmUp: boolean;
}

/**
 * The live analysis's line to the core worker (workers/core-worker.ts), one per Layout desk.
 * Latest wins: at most one request is in the worker; a newer document waiting replaces the one
 * waiting before it, so the worker never computes a frame the drag has already left. `onReply`
 * gets every answer with the document it belongs to; the caller drops answers it no longer needs.
 * `failed` turns true when the worker could not start or stopped (the caller computes on the page then).
 */
export class AnalysisChannel {
  private worker: Worker | null = null;
  private inFlight: Job | null = null;
  private waiting: Job | null = null;
  private seq = 0;
  failed = false;
  /** Called once when the worker fails. */
  onFail: (() => void) | null = null;

  constructor(private readonly onReply: (r: ChannelReply) => void) {}

  private start(): Worker | null {
    if (this.worker || this.failed) return this.worker;
    const w = startCoreWorker();
    if (!w) {
      this.fail();
      return null;
    }
    w.onmessage = (e: MessageEvent<AnalyseWorkerReply>) => this.answer(e.data);
    w.onerror = () => this.fail();
    this.worker = w;
    return w;
  }

  private fail() {
    if (this.failed) return;
    this.failed = true;
    this.onFail?.();
    this.worker?.terminate();
    this.worker = null;
    this.inFlight = this.waiting = null;
  }

  /** Queues the document; returns false when there is no worker (compute on the page instead). */
  request(design: JointDesign, mode: "preview" | "full", warmUp = false): boolean {
    if (!this.start()) return false;
    // A warm-up never displaces a real request.
    if (warmUp && this.waiting && !this.waiting.warmUp) return true;
    this.waiting = { seq: ++this.seq, mode, design, warmUp };
    this.pump();
    return true;
  }

  private pump() {
    const job = this.waiting;
    if (this.inFlight || !job || !this.worker) return;
    this.waiting = null;
    this.inFlight = job;
    this.worker.postMessage({
      type: "analyse",
      seq: job.seq,
      mode: job.mode,
      design: job.design,
    } satisfies AnalyseWorkerRequest);
  }

  private answer(m: AnalyseWorkerReply) {
    const job = this.inFlight;
    if (!job || m.seq !== job.seq) return;
    this.inFlight = null;
    // The next request goes out first: the worker computes while the page shows this answer.
    this.pump();
    if (job.warmUp) return;
    const base = { design: job.design, workerMs: m.ms };
    if (!m.ok) this.onReply({ ...base, mode: m.mode, issues: m.issues });
    else if (m.mode === "full")
      this.onReply({ ...base, mode: "full", full: unpackFull(m.full), issues: null });
    else this.onReply({ ...base, mode: "preview", preview: unpackPreview(m.preview), issues: null });
  }

  dispose() {
    this.worker?.terminate();
    this.worker = null;
    this.inFlight = this.waiting = null;
  }
}
