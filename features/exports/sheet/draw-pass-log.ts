import "server-only";
import { CAUTIONS } from "@/features/ui/cautions";
import {
  passTargetText,
  passTargetUnit,
  type PassLog,
  type PassLogPass,
} from "@/features/exports/model/pass-log";
import { C, heading, type SheetContext } from "./sheet-context";

// The Pass log pages of the bolt-spacing sheet: the tightening record filled in at the joint. One
// row per bolt in the cross sequence, one column per pass with the target and a box for the value
// read, initials and date per pass at the foot of every page, and the cautions on every page.

const KIND_WORDS = { torque: "Torque", elongation: "Stretch", load: "Residual bolt load" } as const;
const ROW_H = 15;
const HEAD_H = 34;
const SIGN_H = 18;
const BOLT_W = 34;
const STEP_W = 34;

/** The three lines over a pass's column (as the Assembly plan names them): "2. pass 1", "cross, by step · 30 %", "target 132 N·m". */
function passHeader(log: PassLog, p: PassLogPass, system: "SI" | "US"): string[] {
  return [
    `${p.pass}. ${p.name}`,
    `${p.pattern === "cross" ? "cross, by step" : "circular, by bolt no."} · ${Math.round(p.fraction * 100)} %`,
    `target ${passTargetText(log.kind, system, p.target)} ${passTargetUnit(log.kind, system)}`,
  ];
}

export function drawPassLog(ctx: SheetContext, log: PassLog): void {
  if (log.passes.length === 0) return;
  const { doc, content } = ctx;
  const w = content.x1 - content.x0;
  const cautions = CAUTIONS.map((c) => `•  ${c}`).join("\n");
  doc.font("sans").fontSize(6.3);
  const cautionsH = doc.heightOfString(cautions, { width: w - 16 }) + 20;
  const passW = (w - BOLT_W - STEP_W) / log.passes.length;
  const colX = (i: number) => content.x0 + BOLT_W + STEP_W + i * passW;
  // Rows in the order of the cross passes (the first cross pass's steps).
  const cross = log.passes.find((p) => p.pattern === "cross") ?? log.passes[0];
  const rows = cross.steps;
  const unit = passTargetUnit(log.kind, ctx.u.system);

  const footer = () => {
    const y = content.y1 - cautionsH;
    doc.rect(content.x0, y, w, cautionsH).fillAndStroke(C.brass50, C.brass300);
    doc
      .font("sansBold")
      .fontSize(7)
      .fillColor(C.brass700)
      .text("Cautions", content.x0 + 8, y + 5, { lineBreak: false });
    doc
      .font("sans")
      .fontSize(6.3)
      .fillColor(C.ink900)
      .text(cautions, content.x0 + 8, y + 15, { width: w - 16 });
  };
  const box = (x: number, y: number, bw: number, bh: number) =>
    doc.lineWidth(0.6).strokeColor(C.ink500).rect(x, y, bw, bh).stroke();
  const columnHeader = () => {
    doc.rect(content.x0, ctx.y, w, HEAD_H).fill(C.ink900);
    doc.font("sansBold").fontSize(6.8).fillColor("#ffffff");
    doc.text("Bolt", content.x0 + 3, ctx.y + 4, { width: BOLT_W - 6, lineBreak: false });
    doc.text("Step", content.x0 + BOLT_W + 3, ctx.y + 4, { width: STEP_W - 6, lineBreak: false });
    log.passes.forEach((p, i) => {
      passHeader(log, p, ctx.u.system).forEach((line, j) =>
        doc
          .font(j === 0 ? "sansBold" : "sans")
          .fontSize(j === 0 ? 6.8 : 6.2)
          .fillColor(j === 2 ? C.brass300 : "#ffffff")
          .text(line, colX(i) + 3, ctx.y + 4 + j * 9.5, { width: passW - 6, lineBreak: false }),
      );
    });
    ctx.y += HEAD_H;
  };
  const signRows = () => {
    for (const label of ["Initials", "Date"]) {
      doc
        .font("sansBold")
        .fontSize(6.8)
        .fillColor(C.ink900)
        .text(label, content.x0 + 3, ctx.y + 5, { width: BOLT_W + STEP_W - 6, lineBreak: false });
      log.passes.forEach((_p, i) => box(colX(i) + 2.5, ctx.y + 2, passW - 5, SIGN_H - 4));
      ctx.y += SIGN_H;
    }
  };
  const bottom = () => content.y1 - cautionsH - 6 - 2 * SIGN_H;
  const startPage = (first: boolean) => {
    ctx.newPage();
    heading(
      ctx,
      first ? "Pass log" : "Pass log (continued)",
      "the tightening record, filled in at the joint",
    );
    if (first) {
      const intro = `${KIND_WORDS[log.kind]} per pass, in ${unit} (${log.basis}). Tighten the cross passes in the order of the Step column and the circular pass bolt after bolt by number. Write the value you read in the box beside each target; when a pass is done on this page, add your initials and the date at its foot.`;
      doc.font("sans").fontSize(7.2).fillColor(C.ink700);
      const h = doc.heightOfString(intro, { width: w });
      doc.text(intro, content.x0, ctx.y, { width: w });
      ctx.y += h + 6;
    }
    columnHeader();
  };
  const row = (s: PassLogPass["steps"][number], zebra: boolean) => {
    const y = ctx.y;
    if (zebra) doc.rect(content.x0, y, w, ROW_H).fill(C.ink50);
    doc
      .font("sansBold")
      .fontSize(7.6)
      .fillColor(C.ink900)
      .text(String(s.boltNumber), content.x0 + 3, y + 4, { width: BOLT_W - 6, lineBreak: false });
    doc
      .font("mono")
      .fontSize(7.2)
      .fillColor(C.ink700)
      .text(String(s.step), content.x0 + BOLT_W + 3, y + 4, { width: STEP_W - 6, lineBreak: false });
    log.passes.forEach((p, i) => {
      const tw = Math.min(passW * 0.42, 40);
      doc
        .font("mono")
        .fontSize(6.8)
        .fillColor(C.ink500)
        .text(passTargetText(log.kind, ctx.u.system, p.target), colX(i) + 2, y + 4.4, {
          width: tw - 4,
          align: "right",
          lineBreak: false,
        });
      box(colX(i) + tw, y + 2, passW - tw - 3, ROW_H - 4);
    });
    doc
      .lineWidth(0.3)
      .strokeColor(C.ink200)
      .moveTo(content.x0, y + ROW_H)
      .lineTo(content.x1, y + ROW_H)
      .stroke();
    ctx.y += ROW_H;
  };
  const endPage = () => {
    ctx.y += 2;
    signRows();
    footer();
  };

  startPage(true);
  rows.forEach((s, i) => {
    if (ctx.y + ROW_H > bottom()) {
      endPage();
      startPage(false);
    }
    row(s, i % 2 === 1);
  });
  endPage();
  // What follows starts on a fresh page: the log's pages are the fitter's own.
  ctx.y = content.y1;
}
