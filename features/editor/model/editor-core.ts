/**
 * The parts of the engineering core the Layout desk runs in the browser: the full analysis, the
 * drag-frame preview, the validator's issue list and the full-area stress grid. Loaded on its own
 * after the page shows (hooks/use-editor-core.ts): the page opens on the stored result, which
 * needs none of them, and they are a third of the desk's JavaScript.
 */
export { analyzeJoint } from "@/features/analysis/core/analyze";
export { previewJoint } from "@/features/analysis/core/preview";
export { validateJointDesign } from "@/features/analysis/core/validate";
export { computeGasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
