import { memo } from "react";
import type { UnitSystem } from "@/features/analysis/core/design";
import type { DesignIssue } from "@/features/analysis/core/validate";
import { CautionPanel } from "@/features/ui/caution-panel";
import type { ReadoutView } from "../model/readout-view";
import { AssemblyPlanView } from "./assembly-plan";
import { BoltTable } from "./bolt-table";
import { CheckList } from "./check-list";
import { EstimatorNote } from "./estimator-note";
import { FlangeSummary } from "@/features/analysis/components/flange-summary";
import { StressProfileChart, type FeTrace } from "./stress-profile-chart";

interface Props {
  view: ReadoutView | null;
  /** A finished FE cross-check of the saved document, drawn on the Seat trace (null otherwise). */
  feTrace?: FeTrace | null;
  issues: DesignIssue[];
  units: UnitSystem;
  activeCheckId: string | null;
  onPickCheck?: (id: string | null) => void;
  onPickBolt?: (id: string) => void;
  /**
   * "preview" while the document differs from the stored one, "stored" when it is the saved
   * result, "held" while a bolt is dragged (the view is the one from the drag start).
   */
  basis: "preview" | "stored" | "held";
}

// Off-screen sections are skipped by the browser's layout and paint (content-visibility), so a
// Readout that catches up after a release redraws only what is on screen.
function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section
      aria-label={title}
      className="border-t border-ink-100 pt-2 [contain-intrinsic-size:auto_240px] [content-visibility:auto]"
    >
      <h3 className="mb-1 text-body font-semibold text-ink-800">{title}</h3>
      {children}
    </section>
  );
}

const BASIS_TEXT = {
  stored: "stored result",
  preview: "live preview",
  held: "held while you drag; updates on release",
} as const;

/** The "Readout": everything the core says about the joint, beside the drawing. Memoised: held views cost nothing per frame. */
export const ReadoutPanel = memo(function ReadoutPanel({
  view,
  issues,
  units,
  activeCheckId,
  onPickCheck,
  onPickBolt,
  basis,
  feTrace = null,
}: Props) {
  const s = view?.analysis.summary;
  return (
    <div className="space-y-3" aria-label="Readout" role="region">
      <div className="flex items-baseline justify-between">
        <h2 className="text-lead font-semibold text-ink-900">Readout</h2>
        <span className="text-micro text-ink-500" data-testid="readout-basis">
          {BASIS_TEXT[basis]}
        </span>
      </div>
      {issues.length > 0 && (
        <div
          role="alert"
          className="rounded-plate border border-verdict-fail bg-verdict-fail-bg p-2 text-table text-verdict-fail"
        >
          <p className="font-semibold">The core cannot analyse this layout yet:</p>
          <ul className="list-disc pl-5">
            {issues.slice(0, 8).map((i) => (
              <li key={i.path + i.message}>
                {i.path}: {i.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      {view && s && (
        <>
          <p className="num text-table" data-testid="check-summary">
            <span className="text-verdict-fail">{s.failCount} fail</span> ·{" "}
            <span className="text-verdict-warn">{s.warnCount} warn</span> ·{" "}
            <span className="text-verdict-pass">{s.passCount} pass</span>
          </p>
          {view.analysis.warnings.length > 0 && (
            <ul className="list-disc pl-5 text-table text-verdict-warn">
              {view.analysis.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          )}
          <Section title="Seat trace">
            <StressProfileChart
              profile={view.profile}
              seatingMpa={view.seatingMpa}
              crushMpa={view.crushMpa}
              units={units}
              fe={feTrace}
            />
          </Section>
          <Section title="Checks">
            <CheckList checks={view.checks} units={units} activeId={activeCheckId} onPick={onPickCheck} />
          </Section>
          <Section title="Flange">
            <FlangeSummary analysis={view.analysis} units={units} />
          </Section>
          <Section title="Bolts">
            <BoltTable analysis={view.analysis} units={units} onPick={onPickBolt} />
          </Section>
          <Section title="Tightening plan">
            <AssemblyPlanView analysis={view.analysis} units={units} />
          </Section>
          <Section title="Estimator">
            <EstimatorNote analysis={view.analysis} units={units} />
          </Section>
        </>
      )}
      <CautionPanel compact />
    </div>
  );
});
