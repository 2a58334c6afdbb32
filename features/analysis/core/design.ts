/**
 * The joint design document: everything the core needs to analyse one bolted, gasketed joint.
 *
 * Internal units, whatever `units` says: lengths in mm, forces in N, stresses and moduli in MPa,
 * moments in N·mm, temperatures in °C. `units` only chooses how results are displayed and which
 * branch of the one unit-dependent rule (ASME VIII-1 Appendix 2 effective gasket width b) is used.
 *
 * Coordinates: the flange centre is the origin, x to the right, y up (model coordinates, not
 * screen coordinates). Bolt positions are arc lengths s along the bolt path, measured clockwise
 * from the top centre line (s = 0 at the topmost point of the path on x = 0).
 *
 * The document is plain serialisable data (JSON round-trips it unchanged). Bump `schemaVersion`
 * when its shape changes and write a migration for stored designs.
 */

export type UnitSystem = "SI" | "US";

export interface PointMm {
  x: number;
  y: number;
}

/** A closed outline centred on the origin (polygon: points in mm, either orientation, no self-intersection). */
export type Outline =
  | { kind: "circle"; diameterMm: number }
  | { kind: "rectangle"; widthMm: number; heightMm: number; cornerRadiusMm: number }
  | { kind: "obround"; lengthMm: number; widthMm: number }
  | { kind: "polygon"; points: PointMm[] };

/**
 * Ring gasket geometry. `annulus`: circular ring on the origin (ID/OD of the sealing element's
 * contact). `band`: a strip of `widthMm` whose centre line is the flange outline offset inward by
 * `centreOffsetMm` (for rectangular, obround and polygonal joints).
 */
export type RingGasketGeometry =
  | { kind: "annulus"; innerDiameterMm: number; outerDiameterMm: number }
  | { kind: "band"; centreOffsetMm: number; widthMm: number };

export interface GasketMaterial {
  name: string;
  /** Catalogue row this was taken from, if any (see catalogue/gaskets.ts). */
  catalogueId?: string;
  /** ASME gasket factor m (dimensionless) and minimum design seating stress y (MPa). */
  m: number;
  yMpa: number;
  /** EN 13555-style tightness parameters from the gasket test report, MPa (optional product data). */
  qMinMpa?: number;
  qsMinMpa?: number;
  qsMaxMpa?: number;
  /** Compressive (unloading) modulus of the gasket, MPa, and its installed thickness, mm. */
  modulusMpa: number;
  thicknessMm: number;
  /** Where these values come from (standard table, test report, data sheet). */
  source: string;
}

export type Gasket =
  | { kind: "ring"; geometry: RingGasketGeometry; material: GasketMaterial }
  /** Covers the flange face inside the outline minus the bore and the bolt holes. */
  | { kind: "full-face"; material: GasketMaterial };

/** Bolt path: a circle on the origin, or the flange outline offset inward by `offsetMm`. */
export type BoltPath = { kind: "circle"; diameterMm: number } | { kind: "offset"; offsetMm: number };

export interface BoltPlacement {
  /** Stable id shown in the editor and used by check ids, e.g. "b3". */
  id: string;
  /** Arc length along the bolt path from the top centre line, clockwise, mm. */
  sMm: number;
  /** Distance off the path along its outward normal, mm (a bolt dragged off the path); default 0. */
  offPathMm?: number;
}

export type ThreadSeries = "metric-coarse" | "unified-8un" | "unc";

export type BoltTermination =
  | { kind: "nut" }
  /** Stud or cap screw into a tapped member of thickness t2 below the clamped layers. */
  | { kind: "tapped-hole"; engagementMm: number; memberThicknessMm: number; memberModulusMpa: number };

/** One strength range of a bolting material: sizes up to `maxDiameterMm` (inclusive), MPa. */
export interface BoltStrengthRange {
  maxDiameterMm: number;
  proofMpa: number | null;
  yieldMpa: number;
  tensileMpa: number;
  /** ASME VIII-1 Appendix 2 allowable at room temperature (null: none). */
  allowableMpa: number | null;
}

/** A Stockroom bolting row as stored (features/library): name, modulus, strengths by size, provenance. */
export interface StockedBoltMaterial {
  name: string;
  modulusMpa: number;
  /** At least one range; a size above the last range takes the last range's strengths. */
  ranges: BoltStrengthRange[];
  source: string;
  edition: string;
}

export interface Fastener {
  /** Nominal size as in the thread catalogue: "M20", "3/4", "1-1/8". */
  designation: string;
  threadSeries: ThreadSeries;
  /**
   * Id of a row in catalogue/bolt-materials.ts, e.g. "astm-a193-b7", or, with `stockedMaterial`,
   * the Stockroom row's id ("org:<uuid>").
   */
  materialId: string;
  /**
   * A copy of the organisation's Stockroom bolting row this fastener is made of (its properties as
   * stored); absent or null: the catalogue row `materialId` names. Changing the Stockroom row later
   * does not change the design.
   */
  stockedMaterial?: StockedBoltMaterial | null;
  /** "stud": threaded full length; "hex-bolt": shank plus standard thread length. */
  form: "stud" | "hex-bolt";
  lengthMm: number;
  /** Bolt hole diameter in the flange, mm (geometry checks, member stiffness, footprint). */
  holeDiameterMm: number;
  /** One washer under each nut/head, or none. */
  washer: { thicknessMm: number; outerDiameterMm: number } | null;
  /**
   * How the bearing face (washer, or nut/head face) loads the members: "rigid" (one flat face,
   * the frustum idealisation) or "flexible" (uniform pressure, softer members). Default "rigid".
   */
  washerActsAs?: "rigid" | "flexible";
  /** Metric nut series for across-flats sizes; inch bolts always use heavy hex (ASME B18.2.2). */
  nutSeries?: "iso-4032" | "iso-old";
  termination: BoltTermination;
  /**
   * Allowable bolt stress entered by the designer, with its source, for bolting that ASME II-D
   * lists no allowable for (e.g. ISO 898-1 classes); used by the Appendix 2 bolt-area check.
   */
  enteredAllowable?: { valueMpa: number; source: string } | null;
}

/** Clamped layers from the nut (or head) side downwards. Exactly one layer is the gasket. */
export type Layer =
  | { role: "flange" | "cover"; thicknessMm: number; materialName: string; modulusMpa: number }
  /** Thickness and modulus come from `gasket.material`. */
  | { role: "gasket" };

export interface DesignLoads {
  designPressureMpa: number;
  designTemperatureC: number;
  /** External axial (separating) force on the whole joint, N. */
  axialLoadN: number;
  /** External bending moment about the x axis, N·mm. */
  momentNmm: number;
}

export type TighteningMethod =
  | "torque-wrench"
  | "turn-of-nut"
  | "hydraulic-tensioner"
  | "load-indicating-washer"
  | "bolt-elongation"
  | "ultrasonic";

export type PreloadRule =
  | { kind: "fraction-of-proof"; value: number }
  | { kind: "fraction-of-yield"; value: number }
  /** Target bolt stress in MPa on the tensile stress area (default) or the root area. */
  | { kind: "bolt-stress"; value: number; areaBasis?: "tensile" | "root" };

export interface AssemblySettings {
  preload: PreloadRule;
  nutFactor: { value: number; source: string };
  method: TighteningMethod;
  /** ± preload scatter as a fraction (0.3 = ±30 %); null uses the method's default. */
  scatterOverride: number | null;
}

export type ConeAngleSetting = { mode: "thickness-dependent" } | { mode: "fixed"; degrees: number };

export interface EstimatorSettings {
  coneAngle: ConeAngleSetting;
  estimator: "auto" | "cone" | "beam";
  /** Samples along the gasket path per bolt pitch (≥ 32 resolves the mid-span minimum). */
  samplesPerPitch: number;
  /** Default heat-map grid size. */
  grid: { nx: number; ny: number };
}

/** An allowable stress entered by the designer, at design and at ambient temperature, with its source. */
export interface EnteredAllowable {
  designMpa: number;
  ambientMpa: number;
  source: string;
}

/**
 * Inputs of the flange and cover design checks (ASME VIII-1 Appendix 2 flange stresses and
 * rigidity, UG-34 flat covers). Absent or `kind: "not-entered"`: those checks say what is missing.
 */
export interface FlangeDesignInputs {
  /** Appendix 2 type of the first "flange" layer. */
  kind: "integral-hub" | "integral-no-hub" | "ring-loose" | "not-entered";
  /** Hub or shell wall: g0 (small end / shell), g1 (back of flange), h (hub length), mm. */
  hub?: { g0Mm: number; g1Mm: number; hMm: number } | null;
  /** Row of catalogue/flange-materials.ts for the flange and for a cover layer. */
  flangeMaterialId?: string | null;
  coverMaterialId?: string | null;
  /** Allowables entered instead of (or over) the catalogue's. */
  flangeAllowable?: EnteredAllowable | null;
  coverAllowable?: EnteredAllowable | null;
  /** UG-34 bolted-cover sketch (catalogue of flat-cover.ts) or an entered C with its source. */
  coverSketch?: { kind: "catalogue"; id: string } | { kind: "entered"; c: number; source: string } | null;
  /** Hydrostatic test pressure entered by the user, MPa (null: not entered). */
  testPressureMpa?: number | null;
}

export interface JointDesign {
  schemaVersion: 1;
  name: string;
  /** Free text: equipment tag, drawing number. */
  description?: string;
  /** Flange template this was started from, e.g. "asme-b16.5-cl150-nps6". */
  templateId?: string;
  units: UnitSystem;
  outline: Outline;
  bore: Outline | null;
  gasket: Gasket;
  boltPath: BoltPath;
  bolts: BoltPlacement[];
  fastener: Fastener;
  layers: Layer[];
  loads: DesignLoads;
  assembly: AssemblySettings;
  estimator: EstimatorSettings;
  flangeDesign?: FlangeDesignInputs;
}

export const DEFAULT_FIXED_CONE_ANGLE_DEG = 30;
export const DEFAULT_SAMPLES_PER_PITCH = 64;
export const MAX_BOLT_COUNT = 512;

export function createDefaultEstimatorSettings(): EstimatorSettings {
  return {
    coneAngle: { mode: "thickness-dependent" },
    estimator: "auto",
    samplesPerPitch: DEFAULT_SAMPLES_PER_PITCH,
    grid: { nx: 128, ny: 128 },
  };
}
