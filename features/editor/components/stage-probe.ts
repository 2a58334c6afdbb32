// A read-only window hook for end-to-end tests and the drag benchmark: which Konva node ids are
// on the stage, and where a bolt is on the page. It exposes no mutation and no data beyond what
// the drawing already shows, so it is installed in production builds too.
import type Konva from "konva";
import type { ViewTransform } from "../model/view-transform";
import { boltNodeId } from "./canvas-ids";

export interface StageProbe {
  has(id: string): boolean;
  ids(prefix: string): string[];
  /** Page (client) coordinates of a bolt centre, for mouse-driven tests. */
  boltClientPoint(boltId: string): { x: number; y: number } | null;
  /** Page coordinates of a model point, mm. */
  modelToClient(xMm: number, yMm: number): { x: number; y: number };
  zoom(): number;
}

declare global {
  interface Window {
    __sealpitchStage?: StageProbe;
  }
}

export function installStageProbe(stage: Konva.Stage, getView: () => ViewTransform): () => void {
  const rect = () => stage.container().getBoundingClientRect();
  const probe: StageProbe = {
    has: (id) => !!stage.findOne(`#${id}`),
    ids: (prefix) => stage.find((n: Konva.Node) => n.id().startsWith(prefix)).map((n) => n.id()),
    boltClientPoint: (boltId) => {
      const node = stage.findOne(`#${boltNodeId(boltId)}`);
      if (!node) return null;
      const p = node.getAbsolutePosition();
      const r = rect();
      return { x: r.left + p.x, y: r.top + p.y };
    },
    modelToClient: (x, y) => {
      const v = getView();
      const r = rect();
      return { x: r.left + v.ox + v.k * x, y: r.top + v.oy - v.k * y };
    },
    zoom: () => getView().k,
  };
  window.__sealpitchStage = probe;
  return () => {
    if (window.__sealpitchStage === probe) delete window.__sealpitchStage;
  };
}
