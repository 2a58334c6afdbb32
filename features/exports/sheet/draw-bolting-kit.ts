import "server-only";
import type { BoltingKit } from "@/features/exports/model/bolting-kit";
import { drawTable } from "./draw-table";
import { C, heading, type SheetContext } from "./sheet-context";

/**
 * The Bolting kit section of the bolt-spacing sheet: studs (or bolts) with the length to order,
 * nuts and washers, one line per distinct item with its count, and how each was worked out. A
 * design whose entered fastener length is shorter than the joint needs gets a note in red.
 */
export function drawBoltingKit(ctx: SheetContext, kit: BoltingKit): void {
  const { u } = ctx;
  heading(
    ctx,
    "Bolting kit",
    `for ${kit.boltCount} bolt positions; what to draw from stores, with the length to order`,
  );
  drawTable(
    ctx,
    [
      { header: "Item", width: 0.4, align: "right", mono: true },
      { header: "Part", width: 1.7, wrap: true },
      { header: "Size", width: 1.5, wrap: true },
      { header: `Length ${u.length}`, width: 0.8, align: "right", mono: true },
      { header: "Material", width: 1.5, wrap: true },
      { header: "Qty", width: 0.45, align: "right", mono: true },
      { header: "How it was worked out", width: 3.6, wrap: true },
    ],
    kit.lines.map((l) => [
      String(l.item),
      l.description,
      l.size,
      l.lengthMm === null ? "—" : u.len(l.lengthMm),
      l.material,
      String(l.quantity),
      l.basis,
    ]),
  );
  const k = kit.length;
  if (k && k.enteredMm + 1e-6 < k.requiredMm) {
    const note = `The design's fastener length (${u.len(k.enteredMm)} ${u.length}) is shorter than the kit's worked length (${u.len(k.requiredMm)} ${u.length}, with the thread beyond the nuts${k.terms.some((t) => t.label.includes("tensioner")) ? " and the tensioner's free thread" : ""}): order the kit's length, or check the fastener length in the design.`;
    ctx.doc.font("sansBold").fontSize(7.2).fillColor(C.fail);
    const h = ctx.doc.heightOfString(note, { width: ctx.content.x1 - ctx.content.x0 });
    ctx.ensure(h + 4);
    ctx.doc.text(note, ctx.content.x0, ctx.y, { width: ctx.content.x1 - ctx.content.x0 });
    ctx.y += h + 6;
  }
}
