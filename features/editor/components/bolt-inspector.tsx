"use client";
import { INPUT_BOUNDS } from "@/features/analysis/core/bounds";
import type { NumberFieldSpec } from "../model/field-specs";
import { getBoltCoordinates } from "../model/set-bolt-coordinates";
import type { FormContext } from "./form-context";
import { NumberField } from "./number-field";

const BIG = INPUT_BOUNDS.planCoordinateMm.max;
const spec = (
  path: string,
  label: string,
  quantity: NumberFieldSpec["quantity"],
  min: number,
  max: number,
): NumberFieldSpec => ({ path, label, quantity, min, max });

/** The selected bolt's coordinates, editable as numbers (x, y, angle from the top, arc position, off-path). */
export function BoltInspector({
  ctx,
  boltId,
  onDelete,
}: {
  ctx: FormContext;
  boltId: string | null;
  onDelete: (id: string) => void;
}) {
  const c = boltId ? getBoltCoordinates(ctx.design, boltId) : null;
  if (!boltId || !c)
    return (
      <p className="text-table text-ink-500">Select a bolt on the drawing to see and type its position.</p>
    );
  const set = (edit: Parameters<FormContext["dispatch"]>[0]) => ctx.dispatch(edit);
  const p = `bolt.${boltId}`;
  return (
    <section aria-label="Selected bolt" className="space-y-2">
      <div className="flex items-center justify-between">
        <h3 className="text-table font-semibold text-ink-800">
          Bolt{" "}
          <span className="num" data-testid="selected-bolt">
            {boltId}
          </span>
        </h3>
        {!ctx.readOnly && (
          <button
            type="button"
            className="text-micro text-verdict-fail hover:underline"
            onClick={() => onDelete(boltId)}
          >
            Remove bolt
          </button>
        )}
      </div>
      <div className="grid grid-cols-2 gap-2">
        <NumberField
          ctx={ctx}
          spec={spec(`${p}.x`, "x", "length", -BIG, BIG)}
          value={c.xMm}
          onCommit={(x) =>
            set({ type: "set-bolt-coordinates", boltId, edit: { kind: "xy", xMm: x, yMm: c.yMm } })
          }
        />
        <NumberField
          ctx={ctx}
          spec={spec(`${p}.y`, "y", "length", -BIG, BIG)}
          value={c.yMm}
          onCommit={(y) =>
            set({ type: "set-bolt-coordinates", boltId, edit: { kind: "xy", xMm: c.xMm, yMm: y } })
          }
        />
        <NumberField
          ctx={ctx}
          spec={spec(`${p}.angle`, "Angle from top, clockwise", "angle", -360, 720)}
          value={c.angleDeg}
          onCommit={(a) =>
            set({ type: "set-bolt-coordinates", boltId, edit: { kind: "angle", angleDeg: a } })
          }
        />
        <NumberField
          ctx={ctx}
          spec={spec(`${p}.s`, "Arc position", "length", -BIG, BIG)}
          value={c.sMm}
          onCommit={(s) => set({ type: "set-bolt-coordinates", boltId, edit: { kind: "arc", sMm: s } })}
        />
        <NumberField
          ctx={ctx}
          spec={spec(`${p}.off`, "Off the path (outward)", "length", -BIG, BIG)}
          value={c.offPathMm}
          onCommit={(o) =>
            set({ type: "set-bolt-coordinates", boltId, edit: { kind: "off-path", offPathMm: o } })
          }
        />
      </div>
      <p className="text-micro text-ink-500">
        A position outside the flange or over another hole is refused by the readout; undo puts it back.
      </p>
    </section>
  );
}
