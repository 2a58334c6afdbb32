"use client";
import { memo } from "react";
import { BoltInspector } from "./bolt-inspector";
import type { FormContext } from "./form-context";
import { FormSectionAssembly } from "./form-section-assembly";
import { FormSectionBolting } from "./form-section-bolting";
import { FormSectionFlange } from "./form-section-flange";
import { FormSectionGasket } from "./form-section-gasket";
import { FormSectionService } from "./form-section-service";

interface Props {
  ctx: FormContext;
  /** The context for the joint data sections; held at the drag-start document while a bolt is dragged. */
  sectionsCtx?: FormContext;
  meta: { name: string; equipmentTag: string };
  onMeta: (m: { name: string; equipmentTag: string }) => void;
  selectedBoltId: string | null;
  onDeleteBolt: (id: string) => void;
}

/** The side panel: the selected bolt (live while dragging), then the joint data sections. */
export function JointForm({ ctx, sectionsCtx, meta, onMeta, selectedBoltId, onDeleteBolt }: Props) {
  return (
    <form className="space-y-4" noValidate onSubmit={(e) => e.preventDefault()} aria-label="Joint data form">
      <BoltInspector ctx={ctx} boltId={selectedBoltId} onDelete={onDeleteBolt} />
      <JointDataSections ctx={sectionsCtx ?? ctx} meta={meta} onMeta={onMeta} />
    </form>
  );
}

// Memoised: a drag frame that changes only bolt positions does not re-render the form fields.
const JointDataSections = memo(function JointDataSections({
  ctx,
  meta,
  onMeta,
}: Pick<Props, "ctx" | "meta" | "onMeta">) {
  return (
    <>
      <FormSectionService ctx={ctx} meta={meta} onMeta={onMeta} />
      <FormSectionGasket ctx={ctx} />
      <FormSectionBolting ctx={ctx} />
      <FormSectionFlange ctx={ctx} />
      <FormSectionAssembly ctx={ctx} />
    </>
  );
});
