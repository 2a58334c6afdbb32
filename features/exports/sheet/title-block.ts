import "server-only";
import { UNVERIFIED_MARK } from "@/features/analysis/unverified-values";
import { fontFor, printable } from "./fonts";
import { C, MARGIN, TITLE_BLOCK_H, type SheetContext } from "./sheet-context";

const STATUS_TEXT = {
  draft: "DRAFT",
  in_review: "IN REVIEW",
  returned: "RETURNED",
  approved: "APPROVED",
} as const;

function cell(
  ctx: SheetContext,
  x: number,
  y: number,
  w: number,
  h: number,
  label: string,
  value: string,
  opts: { mono?: boolean; size?: number; color?: string } = {},
): void {
  const { doc } = ctx;
  const shown = printable(value);
  doc.lineWidth(0.5).strokeColor(C.ink700).rect(x, y, w, h).stroke();
  doc
    .font("sans")
    .fontSize(5.6)
    .fillColor(C.ink500)
    .text(label.toUpperCase(), x + 3.5, y + 3, { lineBreak: false, characterSpacing: 0.4 });
  doc
    .font(fontFor(opts.mono ? "mono" : "sansBold", shown))
    .fontSize(opts.size ?? 8.2)
    .fillColor(opts.color ?? C.ink900)
    .text(shown, x + 3.5, y + 11.5, {
      width: w - 7,
      height: h - 12,
      lineBreak: true,
      ellipsis: true,
    });
}

function date(iso: string | null): string {
  return iso ? iso.slice(0, 10) : "—";
}

/**
 * The title-block strip along the foot of a page: the frame, who/what/which revision, the content
 * hash that identifies the revision's document and result, and "sheet i of n". Our own layout.
 */
export function drawTitleBlock(ctx: SheetContext, pageIndex: number, pageCount: number): void {
  const { doc, pageW, pageH, input } = ctx;
  const { design, revision } = input;
  doc
    .lineWidth(1.2)
    .strokeColor(C.ink900)
    .rect(MARGIN, MARGIN, pageW - 2 * MARGIN, pageH - 2 * MARGIN)
    .stroke();
  const x0 = MARGIN;
  const y0 = pageH - MARGIN - TITLE_BLOCK_H;
  const w = pageW - 2 * MARGIN;
  const rowH = TITLE_BLOCK_H / 2;
  // Brand cell spans both rows.
  const brandW = 92;
  doc.rect(x0, y0, brandW, TITLE_BLOCK_H).fill(C.ink900);
  doc
    .font("sansBold")
    .fontSize(12)
    .fillColor("#ffffff")
    .text("Sealpitch", x0 + 8, y0 + 9, { lineBreak: false });
  doc
    .font("sans")
    .fontSize(6.5)
    .fillColor(C.brass300)
    .text(ctx.label, x0 + 8, y0 + 26, { lineBreak: false, characterSpacing: 0.5 });
  doc
    .font("sans")
    .fontSize(6)
    .fillColor(C.ink200)
    .text(
      `${ctx.u.system === "SI" ? "SI units (mm, MPa, N·m)" : "US units (in, psi, ft·lb)"}`,
      x0 + 8,
      y0 + 38,
      { lineBreak: false },
    );

  const rest = w - brandW;
  const cols1 = [0.3, 0.16, 0.1, 0.44];
  const cols2 = [0.2, 0.2, 0.12, 0.34, 0.14];
  const row1: [string, string, object?][] = [
    ["Design", design.name],
    ["Equipment tag", design.equipmentTag || "—"],
    ["Revision", String(revision.number)],
    // Also printed in words in the strip: text extractors drop the diagonal mark. Table values
    // taken from memory are named here too, on every page, while any remain in the result.
    [
      "Status",
      [
        revision.status === "approved"
          ? STATUS_TEXT.approved
          : `${STATUS_TEXT[revision.status]} · NOT APPROVED`,
        ctx.unverified.length > 0 ? UNVERIFIED_MARK : null,
      ]
        .filter(Boolean)
        .join(" · "),
      {
        color: ctx.unverified.length > 0 ? C.warn : revision.status === "approved" ? C.pass : C.fail,
        size: ctx.unverified.length > 0 ? 6.8 : undefined,
      },
    ],
  ];
  const row2: [string, string, object?][] = [
    ["Designer", revision.designer],
    ["Approver", revision.approver ?? "—"],
    ["Approved", date(revision.approvedAt)],
    ["Content hash (sha-256)", revision.contentHash ?? "not frozen", { mono: true, size: 5.2 }],
    ["Sheet", `${pageIndex + 1} of ${pageCount}`],
  ];
  let x = x0 + brandW;
  row1.forEach(([label, value, o], i) => {
    const cw = rest * cols1[i];
    cell(ctx, x, y0, cw, rowH, label, value, o);
    x += cw;
  });
  x = x0 + brandW;
  row2.forEach(([label, value, o], i) => {
    const cw = rest * cols2[i];
    cell(ctx, x, y0 + rowH, cw, rowH, label, value, o);
    x += cw;
  });
}

/** The large "NOT APPROVED" mark across every page of a sheet whose revision is not approved. */
export function drawNotApprovedMark(ctx: SheetContext, pageIndex: number): void {
  const { doc, pageW, pageH, input } = ctx;
  if (input.revision.status === "approved") return;
  const label = "NOT APPROVED";
  doc.save();
  doc.fillColor(C.fail).fillOpacity(0.13).strokeOpacity(0.5);
  doc.rotate(-35, { origin: [pageW / 2, pageH / 2] });
  doc.font("sansBold").fontSize(84);
  const tw = doc.widthOfString(label);
  doc.text(label, pageW / 2 - tw / 2, pageH / 2 - 50, { lineBreak: false });
  doc.restore();
  // A small stamp as well on the first page (beside the heading), so the state survives a pale copy.
  if (pageIndex > 0) return;
  doc.save();
  const sw = 118;
  const sx = pageW - MARGIN - sw - 10;
  const sy = MARGIN + 8;
  doc.lineWidth(1.4).strokeColor(C.fail).rect(sx, sy, sw, 22).stroke();
  doc
    .font("sansBold")
    .fontSize(11)
    .fillColor(C.fail)
    .text(label, sx, sy + 5, { width: sw, align: "center", lineBreak: false });
  doc.restore();
}
