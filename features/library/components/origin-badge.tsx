import type { RowConfidence } from "../model/dto";

// Where a row comes from at a glance: our own rows, or a built-in row with its confidence tag
// (pub / pub2 / mem / calc / practice, see features/analysis/core/catalogue/confidence.ts).
const TAG_TEXT: Record<RowConfidence, string> = {
  organisation: "Ours",
  pub: "Built-in · published",
  pub2: "Built-in · reproduction",
  mem: "Built-in · unverified",
  calc: "Built-in · calculated",
  practice: "Built-in · practice",
};

export function OriginBadge({ confidence, hidden }: { confidence: RowConfidence; hidden: boolean }) {
  const ours = confidence === "organisation";
  return (
    <span
      className={`inline-block whitespace-nowrap rounded-plate px-1.5 py-0.5 text-micro ${ours ? "bg-brass-100 text-brass-700" : "bg-steel-100 text-ink-600"}`}
      title={`confidence: ${confidence}`}
    >
      {TAG_TEXT[confidence]}
      {hidden ? " · hidden" : ""}
    </span>
  );
}
