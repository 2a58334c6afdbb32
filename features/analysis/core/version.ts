/**
 * Version of the calculation core. Stored with every result so an approved analysis can be
 * reproduced with the code that produced it. Bump the minor version when a result can change
 * for the same design; bump the major version when `JointDesign` or `JointAnalysis` change shape.
 */
export const CORE_VERSION = "2.2.0";
