"use client";
import { useEffect, useMemo, useRef, useState } from "react";
import type { JointDesign, Outline, UnitSystem } from "@/features/analysis/core/design";
import { THREADS } from "@/features/analysis/core/catalogue/threads";
import { getBoltPoints, outlineToPolyline } from "@/features/analysis/core/geometry";
import {
  SUGGESTION_LIMITS,
  checkSuggestionRequest,
  currentOffsetMm,
  isPipeFlange,
  type SuggestionRequest,
} from "@/features/analysis/core/suggest/request";
import type { PatternCandidate } from "@/features/analysis/core/suggest/search";
import { formatIssue } from "@/features/analysis/core/validate";
import type { BoltingChoiceDto } from "@/features/library/model/dto";
import { toolButtonStyles } from "@/features/ui/button-styles";
import { CautionPanel } from "@/features/ui/caution-panel";
import { fetchJson } from "@/features/ui/fetch-json";
import { usePatternSearch } from "../hooks/use-pattern-search";
import {
  cardLength,
  finderLengthsToMm,
  initialFinderLengths,
  pathLengthText,
  type FinderLengths,
  type KeepOutRow,
} from "../model/finder-lengths";
import {
  catalogueChoices,
  stockOfRequest,
  stockroomChoices,
  strengthText,
  type StockSource,
} from "../model/finder-stock";
import { formatQuantity, unitLabel } from "../model/quantities";

/** What the Layout desk records when a candidate is applied ("pattern applied from suggestion 2 of 7"). */
export interface AppliedSuggestion {
  suggestion: number;
  of: number;
}

interface Props {
  design: JointDesign;
  /** The Layout desk's unit system: every length of the dialog is typed and shown in it. */
  units: UnitSystem;
  onApply: (candidate: PatternCandidate, origin: AppliedSuggestion) => void;
  onClose: () => void;
}

const inputClass = "num w-20 rounded border border-ink-200 px-1.5 py-1";
const pct = (m: number | null | undefined) =>
  m === null || m === undefined ? "—" : `${(m * 100).toFixed(1)} %`;

/** The catalogue sizes of the design's thread family; the design's own and its two neighbours each side start ticked. */
function sizeChoices(design: JointDesign) {
  const metric = design.fastener.threadSeries === "metric-coarse";
  const rows = THREADS.filter((t) => (t.series === "metric-coarse") === metric).sort(
    (a, b) => a.nominalDiameterMm - b.nominalDiameterMm,
  );
  const own = rows.findIndex(
    (t) => t.designation === design.fastener.designation && t.series === design.fastener.threadSeries,
  );
  const ticked = new Set(rows.filter((_, i) => own >= 0 && Math.abs(i - own) <= 2).map((t) => t.id));
  return { rows, ticked };
}

/**
 * The "Pattern finder": the dialog behind Suggest pattern. Stock to try (sizes, and bolt materials
 * from our Stockroom's bolting rows, our own analysed with their stored values, or from the
 * catalogue), Path rules (offset range, keep-out zones, fixed bolts, tool clearance, in the desk's
 * units), a run in a worker with progress and Cancel, and the Candidate cards; "Use this pattern"
 * hands the chosen candidate back to the desk.
 */
export function PatternFinder({ design, units, onApply, onClose }: Props) {
  const dialog = useRef<HTMLDialogElement>(null);
  const search = usePatternSearch();
  const sizes = useMemo(() => sizeChoices(design), [design]);
  const [sizeIds, setSizeIds] = useState<Set<string>>(sizes.ticked);
  // null while loading; false when the Stockroom cannot be read (the catalogue stands in).
  const [stockroomRows, setStockroomRows] = useState<BoltingChoiceDto[] | null | false>(null);
  const [source, setSource] = useState<StockSource>("stockroom");
  const from = stockroomRows === false ? "catalogue" : source;
  // Ticked materials by search id, one set per source; the design's own material starts ticked.
  const [ticked, setTicked] = useState<Record<StockSource, Set<string>>>(() => ({
    stockroom: new Set([design.fastener.materialId]),
    catalogue: new Set([design.fastener.materialId]),
  }));
  const offset = currentOffsetMm(design);
  const [lengths, setLengths] = useState<FinderLengths>(() => initialFinderLengths(design, units));
  const setLength = (patch: Partial<FinderLengths>) => setLengths((cur) => ({ ...cur, ...patch }));
  const setKeepOuts = (change: (rows: KeepOutRow[]) => KeepOutRow[]) =>
    setLengths((cur) => ({ ...cur, keepOuts: change(cur.keepOuts) }));
  const { tryOffsets, offsetFrom, offsetTo, offsetStep, keepOuts, clearance } = lengths;
  const unit = unitLabel("length", units);
  const [keepFixed, setKeepFixed] = useState(false);
  const [allowWarnings, setAllowWarnings] = useState(false);
  const pipe = isPipeFlange(design);
  const [straddle, setStraddle] = useState(true);
  const [problems, setProblems] = useState<string[]>([]);

  useEffect(() => {
    const d = dialog.current;
    if (d && !d.open) d.showModal();
  }, []);

  // Our Stockroom's bolting rows: the built-in rows the organisation did not hide and its own rows,
  // which the search analyses with their stored values (as POST /api/v1/suggestions does).
  useEffect(() => {
    let live = true;
    fetchJson<{ rows: BoltingChoiceDto[] }>("/api/v1/library/bolting", "The Stockroom could not be read.")
      .then(({ rows }) => live && setStockroomRows(rows))
      .catch(() => live && setStockroomRows(false));
    return () => {
      live = false;
    };
  }, []);
  const materials = useMemo(
    () => (from === "catalogue" ? catalogueChoices() : stockroomChoices(stockroomRows || [])),
    [from, stockroomRows],
  );
  const materialIds = ticked[from];

  const toggle = (set: Set<string>, id: string, on: boolean) => {
    const next = new Set(set);
    if (on) next.add(id);
    else next.delete(id);
    return next;
  };

  const buildRequest = (): SuggestionRequest | string[] => {
    const mm = finderLengthsToMm(design, lengths, units);
    const errors = mm.ok ? [] : mm.messages;
    const stock = stockOfRequest(from, stockroomRows || [], materialIds);
    const request: SuggestionRequest = {
      design,
      units,
      sizes: sizes.rows
        .filter((t) => sizeIds.has(t.id))
        .map((t) => ({ designation: t.designation, threadSeries: t.series })),
      ...stock,
      ...(mm.ok ? mm.value : {}),
      fixedBoltIds: keepFixed ? design.bolts.map((b) => b.id) : [],
      allowLayoutWarnings: allowWarnings,
      ...(pipe ? { straddleCentreLines: straddle } : {}),
    };
    if (request.sizes!.length === 0) errors.push("Tick at least one bolt size");
    if (request.materialIds!.length === 0) errors.push("Tick at least one bolt material");
    if (errors.length > 0) return errors;
    const issues = checkSuggestionRequest(request);
    return issues.length > 0 ? issues.map(formatIssue) : request;
  };

  const run = () => {
    const built = buildRequest();
    if (Array.isArray(built)) {
      setProblems(built);
      return;
    }
    setProblems([]);
    search.run(built);
  };

  const close = () => {
    search.cancel();
    onClose();
  };

  const s = search.state;
  const running = s.status === "running";
  const result = s.status === "done" ? s.result : null;

  return (
    <dialog
      ref={dialog}
      aria-labelledby="pattern-finder-title"
      className="m-auto max-h-[92vh] w-[min(64rem,96vw)] overflow-y-auto rounded-plate bg-white p-4 text-table text-ink-800 shadow-plate backdrop:bg-ink-900/40"
      onCancel={(e) => {
        e.preventDefault();
        close();
      }}
    >
      <div className="flex items-start justify-between gap-3">
        <div>
          <h2 id="pattern-finder-title" className="text-heading font-semibold text-ink-900">
            Pattern finder
          </h2>
          <p className="text-micro text-ink-600">
            The fewest bolts of the stock you allow that pass every rule; lengths in {unit}, along the bolt
            path clockwise from the top centre line (path length {pathLengthText(design, units)}).
          </p>
        </div>
        <button type="button" className={toolButtonStyles.quiet} onClick={close}>
          Close
        </button>
      </div>

      <div className="mt-3 grid gap-4 md:grid-cols-2">
        <fieldset className="space-y-2" disabled={running}>
          <legend className="font-semibold">Stock to try</legend>
          <div role="group" aria-label="Bolt sizes" className="flex flex-wrap gap-x-3 gap-y-1">
            {sizes.rows.map((t) => (
              <label key={t.id} className="flex items-center gap-1">
                <input
                  type="checkbox"
                  checked={sizeIds.has(t.id)}
                  onChange={(e) => setSizeIds((cur) => toggle(cur, t.id, e.target.checked))}
                />
                <span className="num">{t.designation}</span>
              </label>
            ))}
          </div>
          <div role="radiogroup" aria-label="Bolt materials from" className="flex flex-wrap gap-x-3">
            {(
              [
                ["stockroom", "Our Stockroom's bolting rows"],
                ["catalogue", "The catalogue"],
              ] as const
            ).map(([value, label]) => (
              <label key={value} className="flex items-center gap-1">
                <input
                  type="radio"
                  name="stock-source"
                  value={value}
                  checked={from === value}
                  disabled={value === "stockroom" && stockroomRows === false}
                  onChange={() => setSource(value)}
                />
                {label}
              </label>
            ))}
          </div>
          <div role="group" aria-label="Bolt materials" className="space-y-0.5">
            <p className="text-micro text-ink-600">
              {from === "catalogue"
                ? `Bolt materials of the catalogue${stockroomRows === false ? " (the Stockroom could not be read)" : ""}`
                : stockroomRows === null
                  ? "Reading our Stockroom…"
                  : "Built-in rows we did not hide and our own rows (analysed with their stored values); tick the rows to try"}
            </p>
            {materials.map((m) => (
              <label key={m.searchId} className="flex items-baseline gap-1">
                <input
                  type="checkbox"
                  checked={materialIds.has(m.searchId)}
                  onChange={(e) =>
                    setTicked((cur) => ({ ...cur, [from]: toggle(cur[from], m.searchId, e.target.checked) }))
                  }
                />
                <span>
                  {m.name}
                  {m.ours && <span className="text-micro text-ink-500"> (Ours)</span>}
                  <span className="num text-micro text-ink-600"> {strengthText(m.ranges, units)}</span>
                </span>
              </label>
            ))}
          </div>
        </fieldset>

        <fieldset className="space-y-2" disabled={running}>
          <legend className="font-semibold">Path rules</legend>
          {offset !== null && (
            <div className="flex flex-wrap items-end gap-2">
              <label className="flex items-center gap-1 pb-1">
                <input
                  type="checkbox"
                  checked={tryOffsets}
                  onChange={(e) => setLength({ tryOffsets: e.target.checked })}
                />
                Try bolt-path offsets (now {cardLength(offset, units)} {unit})
              </label>
              {(
                [
                  ["from", "Offset from", offsetFrom, "offsetFrom"],
                  ["to", "Offset to", offsetTo, "offsetTo"],
                  ["step", "Offset step", offsetStep, "offsetStep"],
                ] as const
              ).map(([caption, label, value, key]) => (
                <label key={label} className="flex flex-col">
                  <span className="text-micro text-ink-600">
                    {caption}, {unit}
                  </span>
                  <input
                    aria-label={`${label}, ${unit}`}
                    className={inputClass}
                    value={value}
                    disabled={!tryOffsets}
                    onChange={(e) => setLength({ [key]: e.target.value })}
                  />
                </label>
              ))}
            </div>
          )}
          <div className="space-y-1">
            <p className="text-micro text-ink-600">
              Keep-out zones (nozzle, hinge, lifting lug): no bolt hole between these distances along the path
            </p>
            {keepOuts.map((k, i) => (
              <div key={i} className="flex flex-wrap items-center gap-1">
                {(["from", "to"] as const).map((end) => (
                  <label key={end} className="flex items-center gap-1">
                    {end === "to" && <span>to</span>}
                    <input
                      aria-label={`Keep-out ${i + 1} ${end}, ${unit}`}
                      className={inputClass}
                      value={k[end]}
                      onChange={(e) =>
                        setKeepOuts((c) => c.map((x, j) => (j === i ? { ...x, [end]: e.target.value } : x)))
                      }
                    />
                  </label>
                ))}
                <span>{unit}</span>
                <input
                  aria-label={`Keep-out ${i + 1} label`}
                  placeholder="label"
                  className="w-28 rounded border border-ink-200 px-1.5 py-1"
                  value={k.label}
                  onChange={(e) =>
                    setKeepOuts((c) => c.map((x, j) => (j === i ? { ...x, label: e.target.value } : x)))
                  }
                />
                <button
                  type="button"
                  className={toolButtonStyles.quiet}
                  aria-label={`Remove keep-out ${i + 1}`}
                  onClick={() => setKeepOuts((c) => c.filter((_, j) => j !== i))}
                >
                  ×
                </button>
              </div>
            ))}
            {keepOuts.length < SUGGESTION_LIMITS.keepOuts && (
              <button
                type="button"
                className={toolButtonStyles.secondary}
                onClick={() => setKeepOuts((c) => [...c, { from: "", to: "", label: "" }])}
              >
                Add keep-out
              </button>
            )}
          </div>
          <label className="flex items-center gap-1">
            <input type="checkbox" checked={keepFixed} onChange={(e) => setKeepFixed(e.target.checked)} />
            Keep the current {design.bolts.length} bolts where they are (add bolts between them)
          </label>
          <label className="flex items-center gap-2">
            <span>Extra tool clearance, {unit}</span>
            <input
              aria-label={`Extra tool clearance, ${unit}`}
              className={inputClass}
              value={clearance}
              onChange={(e) => setLength({ clearance: e.target.value })}
            />
          </label>
          <label className="flex items-center gap-1">
            <input
              type="checkbox"
              checked={allowWarnings}
              onChange={(e) => setAllowWarnings(e.target.checked)}
            />
            Accept layout warnings (pitch band, 2a + t, nut edge distance), listed with each candidate
          </label>
          {pipe && (
            <label className="flex items-center gap-1">
              <input type="checkbox" checked={straddle} onChange={(e) => setStraddle(e.target.checked)} />
              Multiple of 4, straddling the centre lines
            </label>
          )}
        </fieldset>
      </div>

      {problems.length > 0 && (
        <ul role="alert" className="mt-2 list-disc pl-5 text-verdict-fail">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}

      <div className="mt-3 flex flex-wrap items-center gap-3">
        <button type="button" className={toolButtonStyles.secondary} onClick={run} disabled={running}>
          Find patterns
        </button>
        {running && (
          <>
            <progress
              aria-label="Search progress"
              max={s.progress?.total ?? 1}
              value={s.progress?.done ?? 0}
              className="w-48"
            />
            <span role="status">
              {s.progress
                ? `${s.progress.done} of ${s.progress.total} combinations, ${s.progress.analyses} analyses`
                : "Starting the search…"}
            </span>
            <button type="button" className={toolButtonStyles.quiet} onClick={search.cancel}>
              Cancel
            </button>
          </>
        )}
        {s.status === "cancelled" && <span role="status">Search cancelled; nothing was changed.</span>}
        {s.status === "error" && (
          <span role="alert" className="text-verdict-fail">
            The search stopped: {s.message}
          </span>
        )}
      </div>

      {result && (
        <section aria-label="Candidate cards" className="mt-3">
          {result.candidates.length === 0 ? (
            <p role="status" className="rounded border border-verdict-fail/40 bg-white p-2">
              {result.message}
            </p>
          ) : (
            <>
              <p role="status" className="text-micro text-ink-600">
                {result.candidates.length} candidates, best first ({result.analyses} analyses over{" "}
                {result.combinations} combinations
                {result.truncated ? "; the work cap ended the search early" : ""}).
              </p>
              <ol className="mt-2 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
                {result.candidates.map((c, i) => (
                  <li
                    key={c.rank}
                    aria-label={`Suggestion ${i + 1} of ${result.candidates.length}`}
                    className="rounded-plate border border-ink-100 p-2"
                  >
                    <CandidatePlan design={c.design} />
                    <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-2 text-micro">
                      <dt>Bolts</dt>
                      <dd className="num">
                        {c.boltCount} × {c.designation}
                      </dd>
                      <dt>Material</dt>
                      <dd>
                        {c.materialName}
                        {c.design.fastener.stockedMaterial && (
                          <span className="text-ink-500"> (our Stockroom row)</span>
                        )}
                      </dd>
                      {c.offsetMm !== null && (
                        <>
                          <dt>Offset</dt>
                          <dd className="num">
                            {cardLength(c.offsetMm, units)} {unit}
                          </dd>
                        </>
                      )}
                      <dt>Pitch</dt>
                      <dd className="num">
                        {cardLength(c.pitchMm.min, units)}–{cardLength(c.pitchMm.max, units)} {unit}
                      </dd>
                      <dt>Lowest seating</dt>
                      <dd className="num">
                        {formatQuantity("stress", c.seating.minMpa, units)} /{" "}
                        {formatQuantity("stress", c.seating.limitMpa, units)} ({pct(c.seating.margin)})
                      </dd>
                      <dt>Governing</dt>
                      <dd>{c.governing ? `${c.governing.title} (${pct(c.governing.margin)})` : "—"}</dd>
                      {c.carried.length > 0 && (
                        <>
                          <dt>Carried</dt>
                          <dd>{c.carried.join(", ")}</dd>
                        </>
                      )}
                    </dl>
                    <button
                      type="button"
                      className={`${toolButtonStyles.secondary} mt-2`}
                      onClick={() => onApply(c, { suggestion: i + 1, of: result.candidates.length })}
                    >
                      Use this pattern
                    </button>
                  </li>
                ))}
              </ol>
            </>
          )}
          <p className="mt-2 text-micro text-ink-600">{result.policy}</p>
        </section>
      )}

      <div className="mt-3">
        <CautionPanel compact />
      </div>
    </dialog>
  );
}

function outlinePath(outline: Outline): string {
  const pts = outlineToPolyline(outline, 8);
  return pts.map((p, i) => `${i === 0 ? "M" : "L"}${p.x.toFixed(1)} ${(-p.y).toFixed(1)}`).join(" ") + " Z";
}

/** A candidate's small drawing: outline, bore and bolt holes to scale (y up, as on the stage). */
function CandidatePlan({ design }: { design: JointDesign }) {
  const points = getBoltPoints(design);
  const outline = outlineToPolyline(design.outline, 8);
  const xs = outline.map((p) => p.x);
  const ys = outline.map((p) => -p.y);
  const pad = 0.04 * Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys));
  const box = [
    Math.min(...xs) - pad,
    Math.min(...ys) - pad,
    Math.max(...xs) - Math.min(...xs) + 2 * pad,
    Math.max(...ys) - Math.min(...ys) + 2 * pad,
  ];
  const r = design.fastener.holeDiameterMm / 2;
  return (
    <svg
      viewBox={box.join(" ")}
      role="img"
      aria-label={`${design.bolts.length} bolts`}
      className="h-32 w-full"
    >
      <path d={outlinePath(design.outline)} className="fill-steel-50 stroke-ink-400" strokeWidth={pad / 6} />
      {design.bore && (
        <path d={outlinePath(design.bore)} className="fill-white stroke-ink-300" strokeWidth={pad / 8} />
      )}
      {points.map((p, i) => (
        <circle key={i} cx={p.x} cy={-p.y} r={r} className="fill-ink-800" />
      ))}
    </svg>
  );
}
