import "server-only";
import { createHash } from "node:crypto";
import PDFDocument from "pdfkit";
import { CAUTIONS } from "@/features/ui/cautions";
import { buildBoltRows, type BoltRow } from "@/features/exports/model/bolt-rows";
import { angle, sheetUnits } from "./format";
import { getSheetFonts } from "./fonts";
import { drawFlange } from "./draw-flange";
import { drawProfileChart } from "./draw-profile-chart";
import { drawKeyValues, drawTable, type Cell } from "./draw-table";
import {
  countNoun,
  countsText,
  coverageText,
  groupByRule,
  justificationsByRule,
  ruleOf,
  rulesNeedingJustification,
  subjectLabel,
  type RuleRow,
} from "@/features/analysis/rule-groups";
import { jointDataItems } from "./joint-data";
import { buildBoltingKit } from "@/features/exports/model/bolting-kit";
import { drawBoltingKit } from "./draw-bolting-kit";
import { buildPassLog } from "@/features/exports/model/pass-log";
import { drawPassLog } from "./draw-pass-log";
import { drawFeSection } from "./draw-fe-section";
import { flangeSummaryLines } from "@/features/analysis/flange-summary";
import {
  normaliseStatus,
  type SheetCheck,
  readResultView,
  type SheetResultView,
  type SheetStatus,
} from "./result-view";
import {
  C,
  MARGIN,
  PAPER_SIZES,
  TITLE_BLOCK_H,
  createContext,
  heading,
  type SheetContext,
} from "./sheet-context";
import type { RenderOptions, SheetInput } from "./sheet-input";
import { drawNotApprovedMark, drawTitleBlock } from "./title-block";

const STATUS_STYLE: Record<SheetStatus, { text: string; color: string; fill: string }> = {
  pass: { text: "PASS", color: C.pass, fill: C.passBg },
  warn: { text: "WARN", color: C.warn, fill: C.warnBg },
  fail: { text: "FAIL", color: C.fail, fill: C.failBg },
  na: { text: "N/A", color: C.na, fill: C.naBg },
  rated: { text: "RATED", color: C.brass700, fill: C.brass50 },
};

/**
 * The file identifier in the trailer. pdfkit derives it from the info dictionary (so from the
 * creation date); we derive it from the content hash instead so that two renders of one revision
 * differ only in the date strings (see `withFileId`).
 */
function fileId(input: SheetInput, kind: SheetKind): Buffer {
  const basis =
    input.revision.contentHash ?? `${input.design.name}|${input.revision.number}|${input.revision.status}`;
  // The bolt-spacing sheet keeps the identifier it always had; the Pass log names its kind.
  const prefix = kind === "spacing-sheet" ? "sealpitch-sheet" : `sealpitch-${kind}`;
  return createHash("sha256")
    .update(`${prefix}|${basis}|${input.paper}|${input.units}`)
    .digest()
    .subarray(0, 16);
}

/**
 * `pdf` with both strings of its trailer's /ID (PDF 32000-1 §14.4) set to `id` (16 bytes). The two
 * hex strings keep their length, so no offset in the cross-reference table moves. Throws when the
 * trailer has no 16-byte /ID pair (a pdfkit that writes it otherwise must be looked at).
 */
export function withFileId(pdf: Buffer, id: Buffer): Buffer {
  const tail = pdf.lastIndexOf("trailer");
  const text = pdf.subarray(tail).toString("latin1");
  const m = /\/ID \[<([0-9a-f]{32})> <([0-9a-f]{32})>\]/i.exec(text);
  if (tail < 0 || !m) throw new Error("sheet: the PDF trailer has no 16-byte /ID pair");
  const hex = id.toString("hex");
  const out = Buffer.from(pdf);
  out.write(`/ID [<${hex}> <${hex}>]`, tail + m.index, "latin1");
  return out;
}

/** The drawing's frame on page 1 (pure, so tests can find the flange on the rendered page). */
export function drawingBox(paper: SheetInput["paper"]): { x: number; y: number; w: number; h: number } {
  const [w, h] = PAPER_SIZES[paper];
  const x0 = MARGIN + 10;
  const x1 = w - MARGIN - 10;
  const y0 = MARGIN + 10;
  const y1 = h - MARGIN - TITLE_BLOCK_H - 8;
  return { x: x0, y: y0 + 36, w: (x1 - x0) * 0.64, h: Math.min(390, (y1 - y0) * 0.55) };
}

function pageOne(ctx: SheetContext, rows: BoltRow[], view: SheetResultView): void {
  const { doc, input, content, u } = ctx;
  const { design, revision } = input;
  doc
    .font("sansBold")
    .fontSize(15)
    .fillColor(C.ink900)
    .text("Bolt-spacing sheet", content.x0, ctx.y, { lineBreak: false });
  doc
    .font("sans")
    .fontSize(9)
    .fillColor(C.ink700)
    .text(
      `${design.equipmentTag ? `${design.equipmentTag} · ` : ""}${design.name} · revision ${revision.number}`,
      content.x0,
      ctx.y + 19,
      { lineBreak: false },
    );
  ctx.y += 36;
  const box = drawingBox(input.paper);
  const drawW = box.w;
  const drawH = box.h;
  doc.lineWidth(0.5).strokeColor(C.ink300).rect(box.x, box.y, box.w, box.h).stroke();
  drawFlange(ctx, box, input.document, rows);
  const sideX = content.x0 + drawW + 12;
  const sideW = content.x1 - sideX;
  const savedY = ctx.y;
  doc
    .font("sansBold")
    .fontSize(8)
    .fillColor(C.ink900)
    .text("JOINT DATA", sideX, ctx.y, { lineBreak: false, characterSpacing: 0.5 });
  ctx.y += 12;
  const items = [...jointDataItems(input.document, u), ...view.keyValues];
  ctx.y = drawKeyValues(ctx, sideX, sideW, items);
  ctx.y = Math.max(ctx.y, savedY + drawH) + 12;
}

function boltTable(ctx: SheetContext, rows: BoltRow[]): void {
  const { u } = ctx;
  heading(
    ctx,
    "Bolt table",
    `${rows.length} bolts · x, y from the flange centre (y up) · angle clockwise from the top · ${u.length}`,
  );
  const byNumber = rows;
  drawTable(
    ctx,
    [
      { header: "No.", width: 0.6, align: "right" },
      { header: "Id", width: 0.7 },
      { header: "Angle °", width: 1, align: "right", mono: true },
      { header: `x ${u.length}`, width: 1.1, align: "right", mono: true },
      { header: `y ${u.length}`, width: 1.1, align: "right", mono: true },
      { header: "Next", width: 0.6, align: "right" },
      { header: `Pitch ${u.length}`, width: 1.1, align: "right", mono: true },
      { header: `Chord ${u.length}`, width: 1.1, align: "right", mono: true },
      { header: "Tightening order", width: 1.1, align: "right" },
    ],
    byNumber.map((r) => [
      { text: String(r.number), style: { bold: true } },
      r.id,
      angle(r.angleDeg),
      u.len(r.xMm),
      u.len(r.yMm),
      r.nextNumber === null ? "—" : String(r.nextNumber),
      r.pitchToNextMm === null ? "—" : u.len(r.pitchToNextMm),
      r.chordToNextMm === null ? "—" : u.len(r.chordToNextMm),
      r.tighteningOrder === null ? "—" : String(r.tighteningOrder),
    ]),
  );
}

/** " — 16 pairs: 12 warn · 4 pass; worst b3–b4" for a rule of many checks; the bolts of a single one. */
function rulesNote(g: RuleRow<SheetCheck>): string {
  const subject = subjectLabel(g.worst);
  if (g.checks.length === 1) return subject ? ` (${subject})` : "";
  return ` — ${countNoun(g.checks.length, g.subject)}: ${countsText(g.counts)}${subject ? `; worst ${subject}` : ""}`;
}

/** "116 % of limit" (floor rules: how much of the value the limit asks for). */
function marginText(g: RuleRow<SheetCheck>): string {
  return g.use === null ? "—" : `${Math.round(g.use * 100)} %`;
}

function checkTable(ctx: SheetContext, view: SheetResultView): void {
  heading(
    ctx,
    "Checks",
    "as stored with the revision; one row per rule, with its worst value; use = share of the limit taken up",
  );
  if (view.checks.length === 0) {
    emptyNote(ctx, "The stored result has no checks.", 16);
    return;
  }
  drawTable(
    ctx,
    [
      { header: "Rule", width: 3, wrap: true },
      { header: "Worst value", width: 1.1, align: "right", mono: true },
      { header: "Limit", width: 1.1, align: "right", mono: true },
      { header: "Use", width: 0.6, align: "right", mono: true },
      { header: "Status", width: 0.65, align: "center" },
      { header: "Source", width: 2.2, wrap: true },
    ],
    groupByRule(view.checks).map((g): Cell[] => {
      const st = STATUS_STYLE[normaliseStatus(g.worst.status)];
      return [
        `${g.title}${rulesNote(g)}`,
        g.worst.valueText,
        g.worst.limitText,
        marginText(g),
        { text: st.text, style: { bold: true, color: st.color, fill: st.fill } },
        g.worst.source || "—",
      ];
    }),
  );
}

function flangeSection(ctx: SheetContext): void {
  const result = ctx.input.result;
  heading(
    ctx,
    "Flange",
    "ASME VIII-1 Appendix 2 flange and UG-34 cover design as stored; the rules are code-specific and a competent engineer signs them off",
  );
  drawTable(
    ctx,
    [
      { header: "Quantity", width: 2.2, wrap: true },
      { header: "Value", width: 5.2, wrap: true },
    ],
    flangeSummaryLines(result, ctx.input.units).map((l): Cell[] => [l.label, l.value]),
  );
}

function justifications(ctx: SheetContext, view: SheetResultView): void {
  const list = ctx.input.justifications;
  const open = rulesNeedingJustification(view.checks);
  if (open.length === 0 && list.length === 0) return;
  heading(ctx, "Justifications", "approved reasons for accepting a rule that warns or fails; one per rule");
  const byRule = justificationsByRule(list);
  const rows: Cell[][] = [];
  const seen = new Set<string>();
  for (const g of open) {
    seen.add(g.rule);
    const st = STATUS_STYLE[normaliseStatus(g.status)];
    const given = byRule.get(g.rule) ?? [];
    const cover = coverageText(g);
    const title = `${g.title}${cover ? ` — ${cover}` : rulesNote(g)}`;
    if (given.length === 0) {
      rows.push([
        title,
        { text: st.text, style: { bold: true, color: st.color } },
        "No approved justification.",
        "—",
      ]);
      continue;
    }
    for (const j of given)
      rows.push([
        title,
        { text: st.text, style: { bold: true, color: st.color } },
        j.text,
        `${j.by}, ${j.at.slice(0, 10)}`,
      ]);
  }
  // Justifications of rules that no longer warn or fail in the stored result (kept, never hidden).
  for (const [rule, given] of byRule) {
    if (seen.has(rule)) continue;
    const title = view.checks.find((c) => ruleOf(c.id) === rule)?.title ?? "A check no longer in the result";
    for (const j of given)
      rows.push([
        title,
        { text: j.status.toUpperCase(), style: { bold: true, color: STATUS_STYLE[j.status].color } },
        j.text,
        `${j.by}, ${j.at.slice(0, 10)}`,
      ]);
  }
  drawTable(
    ctx,
    [
      { header: "Rule", width: 2.4, wrap: true },
      { header: "Status", width: 0.6 },
      { header: "Justification", width: 3.6, wrap: true },
      { header: "Accepted by", width: 1.4, wrap: true },
    ],
    rows,
  );
}

function profileChart(ctx: SheetContext, view: SheetResultView, rows: BoltRow[]): void {
  if (!view.profile) return;
  ctx.ensure(210);
  heading(
    ctx,
    "Gasket stress along the path",
    `${view.profile.pathLabel} · governing estimate: ${view.profile.estimator}`,
  );
  const box = { x: ctx.content.x0, y: ctx.y, w: ctx.content.x1 - ctx.content.x0, h: 180 };
  drawProfileChart(ctx, box, view.profile, rows);
  ctx.y += box.h + 10;
}

function assemblyPlan(ctx: SheetContext, view: SheetResultView, rows: BoltRow[]): void {
  const { doc, u, content } = ctx;
  heading(ctx, "Assembly plan", view.planSource || "tighten in passes, each pass in the sequence below");
  if (view.passes.length > 0) {
    drawTable(
      ctx,
      [
        { header: "Pass", width: 1.1 },
        { header: "Share of target", width: 1, align: "right", mono: true },
        { header: `Torque ${u.torque}`, width: 1, align: "right", mono: true },
        { header: "Pattern and note", width: 4.4, wrap: true },
      ],
      view.passes.map((p) => [
        p.label,
        `${Math.round(p.fraction * 100)} %`,
        u.torque1(p.torqueNmm),
        p.pattern,
      ]),
    );
  } else {
    emptyNote(ctx, "The stored result has no pass plan.", 14);
  }
  if (view.sequenceIds.length > 0) {
    const numberOf = new Map(rows.map((r) => [r.id, r.number]));
    const seq = view.sequenceIds.map((id) => String(numberOf.get(id) ?? id)).join(" – ");
    const w = content.x1 - content.x0;
    doc.font("mono").fontSize(7.2);
    const h = doc.heightOfString(seq, { width: w }) + 11;
    ctx.ensure(h + 6);
    doc
      .font("sansBold")
      .fontSize(7.2)
      .fillColor(C.ink900)
      .text(`Tightening sequence (bolt numbers, ${view.sequenceNote})`, content.x0, ctx.y, {
        lineBreak: false,
      });
    doc
      .font("mono")
      .fontSize(7.2)
      .fillColor(C.ink900)
      .text(seq, content.x0, ctx.y + 11, { width: w });
    ctx.y += h + 10;
  }
}

/** A line of plain text where a section has nothing to show ("The stored result has no checks."). */
function emptyNote(ctx: SheetContext, text: string, gap = 14): void {
  ctx.doc.font("sans").fontSize(7.5).fillColor(C.ink700).text(text, ctx.content.x0, ctx.y);
  ctx.y += gap;
}

/** The brass box of the trade's cautions at the cursor. */
function drawCautionsBox(ctx: SheetContext): void {
  const { doc, content } = ctx;
  const w = content.x1 - content.x0;
  doc.font("sans").fontSize(7.2);
  const text = CAUTIONS.map((c) => `•  ${c}`).join("\n");
  const h = doc.heightOfString(text, { width: w - 16 }) + 26;
  ctx.ensure(h + 8);
  doc.rect(content.x0, ctx.y, w, h).fillAndStroke(C.brass50, C.brass300);
  doc
    .font("sansBold")
    .fontSize(8)
    .fillColor(C.brass700)
    .text("Cautions — before you rely on these numbers", content.x0 + 8, ctx.y + 7, { lineBreak: false });
  doc
    .font("sans")
    .fontSize(7.2)
    .fillColor(C.ink900)
    .text(text, content.x0 + 8, ctx.y + 19, { width: w - 16 });
  ctx.y += h + 10;
}

function cautionsAndEditions(ctx: SheetContext, view: SheetResultView): void {
  const { doc, content } = ctx;
  const w = content.x1 - content.x0;
  drawCautionsBox(ctx);
  heading(
    ctx,
    "Tables and editions used",
    view.coreVersion ? `calculation core ${view.coreVersion}` : undefined,
  );
  if (view.editions.length === 0) {
    emptyNote(ctx, "The stored result lists no tables.", 14);
  } else {
    drawTable(
      ctx,
      [
        { header: "Data", width: 2, wrap: true },
        { header: "Source", width: 3, wrap: true },
        { header: "Edition", width: 2.4, wrap: true },
        { header: "Tag", width: 0.6 },
      ],
      view.editions.map((e) => [e.what, e.source, e.edition, e.confidence]),
    );
  }
  unverifiedValues(ctx);
  const integrity = ctx.input.revision.integrityNote;
  if (integrity) {
    doc
      .font("sans")
      .fontSize(7.2)
      .fillColor(integrity.includes("mismatch") ? C.fail : C.ink700);
    ctx.ensure(14);
    doc.text(integrity, content.x0, ctx.y, { width: w });
    ctx.y += doc.heightOfString(integrity, { width: w }) + 6;
  }
  if (view.warnings.length > 0) {
    heading(ctx, "Notes from the analysis");
    for (const wtext of view.warnings) {
      doc.font("sans").fontSize(7.2).fillColor(C.ink900);
      const hh = doc.heightOfString(`•  ${wtext}`, { width: w });
      ctx.ensure(hh + 2);
      doc.text(`•  ${wtext}`, content.x0, ctx.y, { width: w });
      ctx.y += hh + 2;
    }
  }
}

/** The stored result's table values taken from memory (the list the approver acknowledged). */
function unverifiedValues(ctx: SheetContext): void {
  if (ctx.unverified.length === 0) return;
  heading(
    ctx,
    "Unverified table values",
    `${ctx.unverified.length}: taken from memory, check against the edition in hand`,
  );
  drawTable(
    ctx,
    [
      { header: "Value", width: 2.4, wrap: true },
      { header: "As used", width: 2.4, wrap: true },
      { header: "From", width: 3, wrap: true },
    ],
    ctx.unverified.map((v) => [v.what, v.value, v.source]),
  );
}

type SheetKind = "spacing-sheet" | "pass-log";

const KIND_TITLES: Record<SheetKind, { strip: string; file: string }> = {
  "spacing-sheet": { strip: "BOLT-SPACING SHEET", file: "bolt-spacing sheet" },
  "pass-log": { strip: "PASS LOG", file: "pass log" },
};

type SheetBody = (
  ctx: SheetContext,
  view: SheetResultView,
  rows: BoltRow[],
  progress: (f: number) => Promise<void>,
) => Promise<void>;

/** A PDF of one stored revision: pages drawn by `body`, then the title strip and mark on every page. */
async function renderSheetPdf(
  input: SheetInput,
  options: RenderOptions,
  kind: SheetKind,
  body: SheetBody,
): Promise<Buffer> {
  const fonts = getSheetFonts();
  const [w, h] = PAPER_SIZES[input.paper];
  const title = `${input.design.equipmentTag ? `${input.design.equipmentTag} ` : ""}${input.design.name} rev ${input.revision.number} ${KIND_TITLES[kind].file}`;
  const doc = new PDFDocument({
    size: [w, h],
    margin: 0,
    bufferPages: true,
    autoFirstPage: false,
    // No default font: pdfkit would otherwise load its bundled Helvetica metrics from disk (which
    // a bundled server build does not have); every text call below names one of our fonts.
    font: null as unknown as string,
    info: {
      Title: title,
      Author: input.revision.designer,
      Subject: `Revision ${input.revision.number} (${input.revision.status})`,
      Keywords: input.revision.contentHash ?? "",
      Creator: "Sealpitch",
      Producer: "Sealpitch",
      CreationDate: input.createdAt,
      ModDate: input.createdAt,
    },
  });
  // pdfkit's registerFont also takes an already parsed fontkit font (its font factory accepts any
  // source with layout()); @types/pdfkit lists only paths and buffers.
  for (const [name, font] of Object.entries(fonts)) doc.registerFont(name, font as unknown as Buffer);
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(withFileId(Buffer.concat(chunks), fileId(input, kind))));
    doc.on("error", reject);
  });

  const u = sheetUnits(input.units);
  const view = readResultView(input.result, u);
  const rows = buildBoltRows(input.document, view.sequenceIds, view.boltPoints);
  const ctx = createContext(doc, input, u, KIND_TITLES[kind].strip);
  const progress = async (f: number) => options.onProgress?.(f);
  await body(ctx, view, rows, progress);

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    drawTitleBlock(ctx, i - range.start, range.count);
    drawNotApprovedMark(ctx, i - range.start);
  }
  doc.end();
  const buf = await done;
  await progress(1);
  return buf;
}

/**
 * Renders the bolt-spacing sheet of one stored revision. Deterministic: the same input (with the
 * same `createdAt`) gives the same bytes; another `createdAt` changes only the two date strings.
 * Example: `await renderSpacingSheet({ ...input, paper: "a4", units: "SI" })` → a PDF Buffer.
 */
export async function renderSpacingSheet(input: SheetInput, options: RenderOptions = {}): Promise<Buffer> {
  return renderSheetPdf(input, options, "spacing-sheet", async (ctx, view, rows, progress) => {
    ctx.newPage();
    pageOne(ctx, rows, view);
    await progress(0.2);
    boltTable(ctx, rows);
    await progress(0.5);
    checkTable(ctx, view);
    flangeSection(ctx);
    drawFeSection(ctx, ctx.input.feCheck);
    justifications(ctx, view);
    profileChart(ctx, view, rows);
    await progress(0.7);
    assemblyPlan(ctx, view, rows);
    drawBoltingKit(ctx, buildBoltingKit(input.document, input.units));
    cautionsAndEditions(ctx, view);
    await progress(0.85);
    drawPassLog(ctx, buildPassLog(input.document, input.result, rows));
    await progress(0.9);
  });
}

/**
 * The Pass log alone, as a PDF of its own to take to the joint (the same pages as at the end of
 * the bolt-spacing sheet, with the same title strip, NOT APPROVED mark and cautions). A stored
 * result without a pass plan gets one page that says so.
 */
export async function renderPassLogSheet(input: SheetInput, options: RenderOptions = {}): Promise<Buffer> {
  return renderSheetPdf(input, options, "pass-log", async (ctx, _view, rows) => {
    const log = buildPassLog(input.document, input.result, rows);
    if (log.passes.length > 0) {
      drawPassLog(ctx, log);
      return;
    }
    ctx.newPage();
    emptyNote(ctx, "The stored result has no pass plan: there is nothing to record.", 20);
    drawCautionsBox(ctx);
  });
}
