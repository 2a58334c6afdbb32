"use client";
import { BoltInspector } from "./bolt-inspector";
import type { FormContext } from "./form-context";
import { FormSectionAssembly } from "./form-section-assembly";
import { FormSectionBolting } from "./form-section-bolting";
import { FormSectionGasket } from "./form-section-gasket";
import { FormSectionService } from "./form-section-service";

interface Props {
  ctx: FormContext;
  meta: { name: string; equipmentTag: string };
  onMeta: (m: { name: string; equipmentTag: string }) => void;
  selectedBoltId: string | null;
  onDeleteBolt: (id: string) => void;
}

/** The side panel: the selected bolt, then the joint data sections. */
export function JointForm({ ctx, meta, onMeta, selectedBoltId, onDeleteBolt }: Props) {
  return (
    <form className="space-y-4" noValidate onSubmit={(e) => e.preventDefault()} aria-label="Joint data form">
      <BoltInspector ctx={ctx} boltId={selectedBoltId} onDelete={onDeleteBolt} />
      <FormSectionService ctx={ctx} meta={meta} onMeta={onMeta} />
      <FormSectionGasket ctx={ctx} />
      <FormSectionBolting ctx={ctx} />
      <FormSectionAssembly ctx={ctx} />
    </form>
  );
}
