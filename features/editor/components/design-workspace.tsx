"use client";
import dynamic from "next/dynamic";
import { useCallback, useDeferredValue, useMemo, useRef, useState, useTransition } from "react";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign, UnitSystem } from "@/features/analysis/core/design";
import type { DesignWorkspaceProps } from "@/features/designs/workspace-contract";
import { nextBoltId } from "../model/bolt-path";
import type { DesignAction } from "../model/editor-action";
import type { EditorChoices } from "../model/editor-choices";
import { highlightedBolts, toReadoutView } from "../model/readout-view";
import { renumberBolts } from "../model/renumber-bolts";
import { degreesToArcMm } from "../model/rotate-pattern";
import { useCoreWarmup } from "../hooks/use-core-warmup";
import { useDocumentErrors } from "../hooks/use-document-errors";
import { useDragLoop } from "../hooks/use-drag-loop";
import { useEditorHistory } from "../hooks/use-editor-history";
import { useEditorShortcuts } from "../hooks/use-editor-shortcuts";
import { useHeldWhile } from "../hooks/use-held-while";
import { useLatest } from "../hooks/use-latest";
import { useHeatMap } from "../hooks/use-heat-map";
import { currentGasketPath, useFeCheck } from "@/features/fe-check/components/use-fe-check";
import { useLeaveGuard } from "../hooks/use-leave-guard";
import { useLiveAnalysis } from "../hooks/use-live-analysis";
import { useResultAgreement } from "../hooks/use-result-agreement";
import { useSave } from "../hooks/use-save";
import { DragGauge } from "./drag-gauge";
import { JointCanvas } from "./joint-canvas";
import { JointForm } from "./joint-form";
import type { AppliedSuggestion } from "./pattern-finder";
import { PatternToolbar } from "./pattern-toolbar";
import { ReadoutPanel } from "./readout-panel";
import { SaveBar } from "./save-bar";
import { StressLegend } from "./stress-legend";
import { UnitSwitch } from "./unit-switch";

// The Pattern finder (with the suggestion request's rules) is fetched when it is first opened.
const PatternFinder = dynamic(() => import("./pattern-finder").then((m) => m.PatternFinder), { ssr: false });

/** The "Layout desk": drawing, pattern bench, joint data, readout and saving for one working revision. */
export function DesignWorkspace({
  design: dto,
  saveAction,
  unitSystem,
  setUnitSystemAction,
  readOnly,
  choices,
}: DesignWorkspaceProps & { choices: EditorChoices }) {
  const ro = readOnly ?? !dto.canEdit;
  const editor = useEditorHistory(dto.document);
  const { design, dispatch } = editor;
  const [meta, setMeta] = useState({ name: dto.name, equipmentTag: dto.equipmentTag });
  const [units, setUnits] = useState<UnitSystem>(unitSystem);
  const [unitMessage, setUnitMessage] = useState<string | null>(null);
  const [unitPending, startUnits] = useTransition();
  const [stored, setStored] = useState<{ document: JointDesign; result: JointAnalysis } | null>(
    dto.result ? { document: dto.document, result: dto.result } : null,
  );
  const [selected, setSelected] = useState<string | null>(null);
  const [activeCheck, setActiveCheck] = useState<string | null>(null);
  const [fitToken, setFitToken] = useState(0);
  const [invalid, setInvalidState] = useState<Record<string, true>>({});
  const discarding = useRef(false);
  const [finderOpen, setFinderOpen] = useState(false);
  // The bolt pattern the Pattern finder applied last, until a save records it: the origin goes with
  // a save only while the document still holds exactly that pattern (undone or edited, it does not).
  const applied = useRef<{ bolts: JointDesign["bolts"]; origin: AppliedSuggestion } | null>(null);
  const patternOriginOf = useCallback(
    (doc: JointDesign) =>
      applied.current && applied.current.bolts === doc.bolts ? applied.current.origin : null,
    [],
  );

  const live = useLiveAnalysis(design, stored, editor.dragging);
  useCoreWarmup(design, live.result, !ro, live.channel);
  useResultAgreement(stored);
  const view = useMemo(() => (live.result ? toReadoutView(live.result) : null), [live.result]);
  // The last view the core gave, kept while it refuses the layout (view is null then).
  const lastView = useHeldWhile(view, view === null);
  // While a bolt is dragged the Readout and the joint data sections hold what they showed at the
  // drag start (their tables are the costly part of a frame); the canvas and the drag gauge stay live.
  // The Readout's tables render after the drawing: on release the bolt lands and its marks update
  // at once, and the Readout catches up in a background render React may interrupt.
  // After a release they hold until the core worker's full result has come (`live.pending`), so the
  // pointerup update is only the bolt landing.
  const settling = editor.dragging || live.pending;
  const readoutView = useDeferredValue(useHeldWhile(view, settling));
  const readoutIssues = useDeferredValue(useHeldWhile(live.issues, settling));
  // A drag frame the core refuses (a hole over its neighbour's) keeps the last strip on the drawing.
  // A finished FE cross-check of the saved document: its curve on the Seat trace, and the heat
  // map may show its field. Never over an edited layout: the run is of the saved one.
  const feCheck = useFeCheck(dto.designId, dto.revisionNumber);
  const savedPath = currentGasketPath(feCheck.fe);
  const fePath = savedPath && live.stored && !editor.dragging ? savedPath : null;
  const [heatSource, setHeatSource] = useState<"estimate" | "fe">("estimate");
  const feField = heatSource === "fe" ? fePath : null;
  const heat = useHeatMap(design, editor.dragging ? lastView : view, settling, feField);

  const setInvalid = useCallback((path: string, bad: boolean) => {
    setInvalidState((cur) => {
      if (bad === !!cur[path]) return cur;
      const next = { ...cur };
      if (bad) next[path] = true;
      else delete next[path];
      return next;
    });
  }, []);

  const onSaved = useCallback((result: JointAnalysis, doc: JointDesign) => {
    setStored({ document: doc, result });
    if (applied.current?.bolts === doc.bolts) applied.current = null;
  }, []);
  const invalidCount = Object.keys(invalid).length;
  const docErrors = useDocumentErrors(design, settling, null);
  const blockedReason =
    invalidCount > 0
      ? "Fix the marked fields before saving; nothing with a refused value is written."
      : docErrors.schemaErrorCount > 0
        ? `Not saved: ${docErrors.schemaMessages.slice(0, 3).join("; ")}`
        : null;
  const save = useSave({
    designId: dto.designId,
    initialVersion: dto.version,
    initialDocument: dto.document,
    document: design,
    meta,
    saveAction,
    blocked: !!blockedReason || settling,
    enabled: !ro,
    onSaved,
    patternOriginOf,
  });
  const serverErrors = useDocumentErrors(design, true, save.fieldErrors);
  const errorFor = useCallback(
    (p: string) => docErrors.errorFor(p) ?? serverErrors.errorFor(p),
    [docErrors, serverErrors],
  );
  useLeaveGuard(save.dirty, discarding);

  const act = useCallback((a: DesignAction) => dispatch(a), [dispatch]);
  // The core's share of a drag frame, for the drag benchmark (read after the frame's commit).
  const frameCompute = useLatest({
    computeMs: live.computeMs,
    workerMs: live.workerMs,
    analysed: live.result !== null,
  });
  const drag = useDragLoop(design, dispatch, frameCompute, live.frames);

  const reloadTheirs = () => {
    if (!window.confirm("Discard your unsaved edits and load the version someone else saved?")) return;
    discarding.current = true;
    window.location.reload();
  };
  const boltCount = design.bolts.length;
  const deleteBolt = useCallback(
    (id: string) => {
      if (boltCount <= 1) return;
      act({ type: "delete-bolts", boltIds: [id] });
      setSelected(null);
    },
    [act, boltCount],
  );
  useEditorShortcuts(
    {
      undo: editor.undo,
      redo: editor.redo,
      save: () => void save.save(),
      fit: () => setFitToken((t) => t + 1),
      deleteSelected: () => selected && deleteBolt(selected),
      nudge: (steps) =>
        selected &&
        act({ type: "nudge-bolt", boltId: selected, deltaMm: steps * (units === "US" ? 25.4 / 16 : 1) }),
    },
    !ro,
  );

  const changeUnits = (u: UnitSystem) => {
    setUnits(u);
    setUnitMessage(null);
    startUnits(async () => {
      const r = await setUnitSystemAction(u);
      if (!r.ok) setUnitMessage(`The units are switched here but could not be remembered: ${r.message}`);
    });
  };

  const checks = lastView?.checks ?? [];
  const highlight = highlightedBolts(view, { checkId: activeCheck ?? undefined });
  const ctx = useMemo(
    () => ({ design, units, readOnly: ro, choices, dispatch: act, setInvalid, errorFor }),
    [design, units, ro, choices, act, setInvalid, errorFor],
  );
  const sectionsCtx = useHeldWhile(ctx, settling);

  return (
    <div className="space-y-3" data-testid="design-workspace">
      <header className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <h1 className="text-heading font-semibold text-ink-900">{meta.name}</h1>
          <p className="text-table text-ink-600">
            {meta.equipmentTag && <span className="num">{meta.equipmentTag} · </span>}revision{" "}
            {dto.revisionNumber} · {dto.status.replace("_", " ")} · {dto.ownerName}
            {ro && <span className="ml-2 rounded bg-ink-100 px-1.5 text-micro">read only</span>}
          </p>
        </div>
        <div className="flex flex-col items-end gap-1">
          <UnitSwitch units={units} onChange={changeUnits} pending={unitPending} />
          {unitMessage && (
            <p role="alert" className="text-micro text-verdict-warn">
              {unitMessage}
            </p>
          )}
        </div>
        <div className="w-full max-w-xl">
          <SaveBar
            state={save.saveState}
            version={save.version}
            message={save.message}
            blockedReason={save.dirty ? blockedReason : null}
            readOnly={ro}
            onSave={() => void save.save()}
            onReloadTheirs={reloadTheirs}
          />
        </div>
      </header>
      <div className="grid gap-3 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="min-w-0 space-y-3">
          <div className="overflow-hidden rounded-plate bg-white shadow-plate">
            <PatternToolbar
              boltCount={design.bolts.length}
              readOnly={ro}
              canUndo={editor.canUndo}
              canRedo={editor.canRedo}
              onPlace={(n, onCentre) => {
                act({ type: "place-equally", count: n, options: { phase: onCentre ? 0 : 0.5 } });
                setSelected(null);
              }}
              onRotate={(deg) => act({ type: "rotate-pattern", deltaMm: degreesToArcMm(design, deg) })}
              onRenumber={() => {
                const { idMap } = renumberBolts(design);
                act({ type: "renumber" });
                setSelected((s) => (s ? (idMap[s] ?? null) : null));
              }}
              onUndo={editor.undo}
              onRedo={editor.redo}
              onFit={() => setFitToken((t) => t + 1)}
              onSuggest={() => setFinderOpen(true)}
            />
            {finderOpen && (
              <PatternFinder
                design={design}
                units={units}
                onClose={() => setFinderOpen(false)}
                onApply={(candidate, origin) => {
                  // One undoable step: the whole document with the candidate's fastener, path and bolts.
                  applied.current = { bolts: candidate.design.bolts, origin };
                  act({ type: "replace-design", design: candidate.design });
                  setSelected(null);
                  setFinderOpen(false);
                }}
              />
            )}
            <div className="relative h-[560px]">
              <JointCanvas
                design={design}
                checks={checks}
                heat={heat.stage}
                units={units}
                selectedId={selected}
                highlightBoltIds={highlight}
                readOnly={ro}
                fitToken={fitToken}
                onSelect={setSelected}
                onDragStart={drag.onDragStart}
                onDragMove={drag.onDragMove}
                onDragEnd={drag.onDragEnd}
                onDrawn={drag.onDrawn}
                onAddBolt={(s) => {
                  const id = nextBoltId(design);
                  act({ type: "add-bolt", sMm: s });
                  setSelected(id);
                }}
              />
              {editor.dragging && <DragGauge view={view} issues={live.issues} units={units} />}
            </div>
            {heat.scale && (
              <div className="border-t border-ink-100 px-1">
                <div className="flex flex-wrap items-end justify-between gap-2">
                  <StressLegend
                    scale={heat.scale}
                    units={units}
                    basis={feField ? "FE cross-check, minimum preload" : "minimum preload"}
                  />
                  {fePath && <HeatSourceSwitch value={heatSource} onChange={setHeatSource} />}
                </div>
              </div>
            )}
          </div>
          <ReadoutPanel
            view={readoutView}
            issues={readoutIssues}
            units={units}
            activeCheckId={activeCheck}
            onPickCheck={setActiveCheck}
            onPickBolt={setSelected}
            basis={settling ? "held" : live.stored ? "stored" : "preview"}
            feTrace={fePath}
          />
        </div>
        <aside aria-label="Joint data" className="space-y-4 rounded-plate bg-white p-3 shadow-plate">
          <JointForm
            ctx={ctx}
            sectionsCtx={sectionsCtx}
            meta={meta}
            onMeta={setMeta}
            selectedBoltId={selected}
            onDeleteBolt={deleteBolt}
          />
        </aside>
      </div>
    </div>
  );
}

/** The "Field" switch under the drawing: the heat map from the estimate or from the FE cross-check. */
function HeatSourceSwitch({
  value,
  onChange,
}: {
  value: "estimate" | "fe";
  onChange: (v: "estimate" | "fe") => void;
}) {
  const options = [
    { v: "estimate", label: "Estimate" },
    { v: "fe", label: "FE cross-check" },
  ] as const;
  return (
    <fieldset className="flex items-center gap-2 p-2 text-micro text-ink-700">
      <legend className="sr-only">Heat map field</legend>
      <span aria-hidden="true" className="font-medium">
        Field
      </span>
      {options.map((o) => (
        <label key={o.v} className="flex cursor-pointer items-center gap-1">
          <input
            type="radio"
            name="heat-source"
            value={o.v}
            checked={value === o.v}
            onChange={() => onChange(o.v)}
          />
          {o.label}
        </label>
      ))}
    </fieldset>
  );
}
