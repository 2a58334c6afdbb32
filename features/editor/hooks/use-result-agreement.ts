"use client";
import { useEffect } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import { CORE_VERSION } from "@/features/analysis/core/version";
import { firstDifference } from "../model/results-agree";
import { loadEditorCore } from "./use-editor-core";

export interface AgreementRecord {
  checkedAt: number;
  agree: boolean;
  difference: string | null;
}

declare global {
  interface Window {
    __sealpitchAgreement?: AgreementRecord[];
  }
}

/**
 * Development and test assertion: the browser's core must reproduce the stored server result
 * exactly. Runs once per stored result (after load and after every save); records the outcome on
 * `window.__sealpitchAgreement` (read by the end-to-end test) once the browser's core has come and logs a mismatch loudly. A result
 * stored by another core version is not compared: it may differ by design until the next save.
 */
export function useResultAgreement(stored: { document: JointDesign; result: JointAnalysis } | null) {
  useEffect(() => {
    if (!stored) return;
    if (stored.result.coreVersion !== CORE_VERSION) return;
    let live = true;
    const id = window.setTimeout(() => {
      void loadEditorCore().then(({ analyzeJoint }) => {
        if (!live) return;
        let difference: string | null;
        try {
          // Compare as JSON values: the stored copy has been through JSON and jsonb.
          difference = firstDifference(
            JSON.parse(JSON.stringify(analyzeJoint(stored.document))),
            stored.result,
          );
        } catch (err) {
          difference = `analyzeJoint threw: ${err instanceof Error ? err.message : String(err)}`;
        }
        (window.__sealpitchAgreement ??= []).push({
          checkedAt: Date.now(),
          agree: difference === null,
          difference,
        });
        if (difference)
          console.error(`Sealpitch: the browser's analysis differs from the stored result at ${difference}`);
      });
    }, 50);
    return () => {
      live = false;
      window.clearTimeout(id);
    };
  }, [stored]);
}
