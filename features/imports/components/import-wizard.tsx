"use client";

import { startTransition, useActionState, useMemo, useState } from "react";
import type { UnitSystem } from "@/features/analysis/core/design";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { TextField } from "@/features/ui/text-field";
import { importDesignAction } from "../actions";
import type { AssumedUnit } from "../model/dxf-units";
import { prepareImport } from "../model/prepare-import";
import { GeometryPreview } from "./geometry-preview";
import { ReadingPanel } from "./reading-panel";

// Drawing intake: choose a DXF (and optionally a CSV of bolt positions), look at what was found,
// then create the design. Nothing is stored until "Create design" is pressed.
export function ImportWizard({ units }: { units: UnitSystem }) {
  const [state, action, pending] = useActionState(importDesignAction, null);
  const [dxfText, setDxfText] = useState<string | null>(null);
  const [csvBytes, setCsvBytes] = useState<Uint8Array | null>(null);
  const [csvUnit, setCsvUnit] = useState<"mm" | "in">("mm");
  const [layersOn, setLayersOn] = useState<string[] | null>(null);
  const [dxfUnit, setDxfUnit] = useState<AssumedUnit | null>(null);
  const [name, setName] = useState("");
  const prepared = useMemo(
    () =>
      dxfText
        ? prepareImport({
            dxfText,
            csv: csvBytes,
            csvUnit,
            layersOn: layersOn ?? undefined,
            dxfUnit: dxfUnit ?? undefined,
            name: name || "Imported flange",
            units,
          })
        : null,
    [dxfText, csvBytes, csvUnit, layersOn, dxfUnit, name, units],
  );
  const reading = prepared ? (prepared.ok ? prepared.dxf.reading : prepared.reading) : undefined;
  const e = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    // Submitted through onSubmit, not the action prop: React resets a form after an action, which
    // would wipe what the user typed when the server refuses a field.
    <form
      onSubmit={(ev) => {
        ev.preventDefault();
        const data = new FormData(ev.currentTarget);
        startTransition(() => action(data));
      }}
      className="grid gap-6 lg:grid-cols-[22rem_1fr]"
    >
      <div className="flex flex-col gap-4">
        <label className="flex flex-col gap-1 text-table font-medium text-ink-800">
          DXF drawing (outline and holes)
          <input
            type="file"
            name="dxf"
            accept=".dxf"
            required
            onChange={async (ev) => {
              setLayersOn(null);
              setDxfUnit(null);
              setDxfText((await ev.target.files?.[0]?.text()) ?? null);
            }}
          />
          {e.dxf ? <span className="text-verdict-fail">{e.dxf[0]}</span> : null}
        </label>
        <label className="flex flex-col gap-1 text-table font-medium text-ink-800">
          Bolt positions CSV (optional: columns x, y, d, or a Sealpitch hole list; replaces the DXF holes)
          <input
            type="file"
            name="csv"
            accept=".csv,text/csv"
            onChange={async (ev) => {
              const file = ev.target.files?.[0];
              setCsvBytes(file ? new Uint8Array(await file.arrayBuffer()) : null);
            }}
          />
          {e.csv ? <span className="text-verdict-fail">{e.csv[0]}</span> : null}
        </label>
        <label className="flex flex-col gap-1 text-table font-medium text-ink-800">
          CSV units (when the header does not say)
          <select
            name="csvUnit"
            value={csvUnit}
            onChange={(ev) => setCsvUnit(ev.target.value as "mm" | "in")}
            className="rounded-plate border border-ink-200 bg-white px-2 py-1.5"
          >
            <option value="mm">mm</option>
            <option value="in">inches</option>
          </select>
        </label>
        <TextField
          label="Design name"
          name="name"
          required
          value={name}
          onChange={(ev) => setName(ev.target.value)}
          errors={e.name}
        />
        <TextField label="Equipment tag" name="equipmentTag" errors={e.equipmentTag} hint="e.g. E-2107" />
        {reading ? (
          <>
            <input
              type="hidden"
              name="layersOn"
              value={JSON.stringify(reading.layers.filter((l) => l.on).map((l) => l.name))}
            />
            {!reading.units.stated ? (
              <input type="hidden" name="dxfUnit" value={reading.units.assumed} />
            ) : null}
          </>
        ) : null}
        <button type="submit" className={buttonStyles.primary} disabled={pending || !prepared?.ok}>
          Create design
        </button>
        <FormStatus state={state} />
      </div>
      <div className="flex flex-col gap-3" aria-live="polite">
        {!prepared ? (
          <p className="text-body text-ink-500">Choose a DXF drawing to see what will be imported.</p>
        ) : null}
        {prepared && !prepared.ok ? (
          <p className="text-body text-verdict-fail" role="alert" data-testid="import-refusal">
            {prepared.message}
          </p>
        ) : null}
        {reading ? (
          <ReadingPanel reading={reading} onLayers={(on) => setLayersOn(on)} onUnit={(u) => setDxfUnit(u)} />
        ) : null}
        {prepared?.ok ? (
          <>
            <GeometryPreview design={prepared.built.design} holeDiameterMm={prepared.built.holeDiameterMm} />
            <dl
              className="grid grid-cols-[10rem_1fr] gap-x-4 gap-y-1 text-table"
              data-testid="import-summary"
            >
              <dt className="text-ink-600">Drawing units</dt>
              <dd>{prepared.summary.unitsLabel}</dd>
              <dt className="text-ink-600">Outline</dt>
              <dd className="num">
                {prepared.summary.outlineText}
                {prepared.dxf.reading.outlineText ? ` — ${prepared.dxf.reading.outlineText}` : ""}
              </dd>
              <dt className="text-ink-600">Bolt holes</dt>
              <dd className="num">
                {prepared.summary.holeCount} × Ø {Math.round(prepared.summary.holeDiameterMm * 100) / 100} mm
                (
                {prepared.summary.boltsFrom === "csv"
                  ? `from the CSV: ${prepared.summary.csvFormat}`
                  : "from the DXF"}
                )
              </dd>
              <dt className="text-ink-600">Bore</dt>
              <dd className="num">
                {prepared.summary.boreDiameterMm
                  ? `Ø ${Math.round(prepared.summary.boreDiameterMm * 10) / 10} mm`
                  : "none found"}
              </dd>
              <dt className="text-ink-600">Bolt path</dt>
              <dd className="num">{prepared.summary.boltPathText}</dd>
              <dt className="text-ink-600">Bolts</dt>
              <dd>
                {prepared.built.design.fastener.designation} (largest size that fits the holes; change it in
                the editor)
              </dd>
            </dl>
            {prepared.summary.warnings.map((w) => (
              <p key={w} className="text-table text-verdict-warn">
                {w}
              </p>
            ))}
          </>
        ) : null}
      </div>
    </form>
  );
}
