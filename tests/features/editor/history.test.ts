import { describe, expect, it } from "vitest";
import { designReducer } from "@/features/editor/model/design-reducer";
import { canRedo, canUndo, createHistory, withHistory } from "@/features/editor/model/history";
import { makeCover } from "./fixtures";

const reduce = withHistory(designReducer);

describe("undo and redo", () => {
  it("records design changes and undoes them in order", () => {
    const d = makeCover();
    let h = createHistory(d);
    h = reduce(h, { type: "place-equally", count: 16 });
    h = reduce(h, { type: "set-field", path: "loads.designPressureMpa", value: 3 });
    expect(h.past).toHaveLength(2);
    h = reduce(h, { type: "undo" });
    expect(h.present.loads.designPressureMpa).toBe(1);
    expect(h.present.bolts).toHaveLength(16);
    h = reduce(h, { type: "undo" });
    expect(h.present).toBe(d);
    expect(canUndo(h)).toBe(false);
    h = reduce(h, { type: "redo" });
    expect(h.present.bolts).toHaveLength(16);
    expect(canRedo(h)).toBe(true);
  });

  it("makes one history entry per completed drag, however many moves it had", () => {
    const d = makeCover();
    let h = createHistory(d);
    h = reduce(h, { type: "drag-start" });
    for (let i = 1; i <= 30; i++)
      h = reduce(h, { type: "move-bolt", boltId: "b1", sMm: 60 + i, offPathMm: 0 });
    expect(h.past).toHaveLength(0);
    expect(canUndo(h)).toBe(false);
    h = reduce(h, { type: "drag-end" });
    expect(h.past).toHaveLength(1);
    expect(h.present.bolts[0].sMm).toBe(90);
    h = reduce(h, { type: "undo" });
    expect(h.present).toBe(d);
  });

  it("records nothing for a drag that did not move and for a no-op action", () => {
    const d = makeCover();
    let h = createHistory(d);
    h = reduce(h, { type: "drag-start" });
    h = reduce(h, { type: "drag-end" });
    h = reduce(h, { type: "set-field", path: "loads.designPressureMpa", value: 1 });
    h = reduce(h, { type: "delete-bolts", boltIds: ["nope"] });
    expect(h.past).toHaveLength(0);
    expect(h.present).toBe(d);
  });

  it("clears the redo stack on a new edit and on reset", () => {
    let h = createHistory(makeCover());
    h = reduce(h, { type: "rotate-pattern", deltaMm: 5 });
    h = reduce(h, { type: "undo" });
    expect(h.future).toHaveLength(1);
    h = reduce(h, { type: "renumber" });
    h = reduce(h, { type: "add-bolt", sMm: 3 });
    expect(h.future).toHaveLength(0);
    const fresh = makeCover();
    h = reduce(h, { type: "reset", design: fresh });
    expect(h).toEqual(createHistory(fresh));
  });
});
