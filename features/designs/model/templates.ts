// Design templates: each turns a handful of dimensions into a complete JointDesign with bolts
// equally spaced along the bolt path, straddling the centre lines (core geometry helper).
// Pure functions; the form's zod schemas (../schema.ts) check the numbers before these run.
import type { JointDesign, Layer, Outline, PointMm, UnitSystem } from "@/features/analysis/core/design";
import { getBoltPathLengthMm, placeBoltsEqually } from "@/features/analysis/core/geometry";
import {
  getFlangeTemplateById,
  type FlangeTemplateRow,
} from "@/features/analysis/core/catalogue/flange-templates";
import {
  DEFAULT_GASKET_TYPE_ID,
  DEFAULT_PIPE_GASKET_TYPE_ID,
  FULL_FACE_GASKET_TYPE_ID,
  STEEL_MODULUS_MPA,
  buildFastener,
  defaultJointSettings,
  gasketMaterialFromCatalogue,
  metricHoleDiameterMm,
  nominalDiameterMm,
  type MetricBoltSize,
} from "./template-defaults";

export type TemplateKind =
  | "circular-flange"
  | "full-face-flange"
  | "pipe-flange"
  | "rectangular-cover"
  | "obround-manway"
  | "polygon-cover";

export interface CircularFlangeParams {
  outsideDiameterMm: number;
  boreDiameterMm: number;
  boltCircleDiameterMm: number;
  boltCount: number;
  boltSize: MetricBoltSize;
  flangeThicknessMm: number;
}
export interface PipeFlangeParams {
  flangeTemplateId: string;
  flangeThicknessMm: number;
}
interface CoverParams {
  boltEdgeDistanceMm: number;
  boltCount: number;
  boltSize: MetricBoltSize;
  coverThicknessMm: number;
  flangeThicknessMm: number;
  gasketWidthMm: number;
}
export interface RectangularCoverParams extends CoverParams {
  widthMm: number;
  heightMm: number;
  cornerRadiusMm: number;
}
export interface ObroundManwayParams extends CoverParams {
  lengthMm: number;
  widthMm: number;
}
export interface PolygonCoverParams extends CoverParams {
  points: PointMm[];
}

export type TemplateInput =
  | ({ kind: "circular-flange" } & CircularFlangeParams)
  | ({ kind: "full-face-flange" } & CircularFlangeParams)
  | ({ kind: "pipe-flange" } & PipeFlangeParams)
  | ({ kind: "rectangular-cover" } & RectangularCoverParams)
  | ({ kind: "obround-manway" } & ObroundManwayParams)
  | ({ kind: "polygon-cover" } & PolygonCoverParams);

export interface DocumentMeta {
  name: string;
  equipmentTag: string;
  units: UnitSystem;
}

/** Radial gap kept between a gasket edge and a bolt hole or the bore, mm [practice]. */
const GAP_MM = 3;

/**
 * Pipe outside diameters (ASME B36.10 [mem]) used as the bore of a catalogue pipe flange; the
 * gasket's inner edge sits just outside it, like a B16.21 flat ring.
 */
const PIPE_OUTSIDE_DIAMETER_MM: Record<string, number> = {
  "2": 60.3,
  "4": 114.3,
  "6": 168.3,
  "8": 219.1,
  "10": 273.1,
  "12": 323.9,
  "16": 406.4,
  "24": 609.6,
};

function base(
  meta: DocumentMeta,
): Pick<JointDesign, "schemaVersion" | "name" | "description" | "units"> &
  ReturnType<typeof defaultJointSettings> {
  return {
    schemaVersion: 1,
    name: meta.name,
    units: meta.units,
    ...defaultJointSettings(),
  };
}

// How the templates bolt a joint [practice]: metric 8.8 bolts with washers through carbon steel
// plate, or B7 studs without washers through the forged steel of a catalogue pipe flange.
const BOLTING = {
  metric: { materialId: "iso-898-1-8.8", withWasher: true, plateMaterial: "Carbon steel plate" },
  pipe: { materialId: "astm-a193-b7", withWasher: false, plateMaterial: "ASTM A105 forged steel" },
} as const;

type JointParts = Omit<JointDesign, "bolts" | "fastener" | "layers" | keyof ReturnType<typeof base>>;

/**
 * A template's design: two plates (a flange or a cover, then a flange) clamping the gasket, the
 * fastener sized for that grip, and `count` bolts spaced equally along the bolt path.
 */
function boltedJoint(
  meta: DocumentMeta,
  parts: JointParts,
  bolting: { kind: keyof typeof BOLTING; designation: string; holeDiameterMm: number; count: number },
  plates: { first: "flange" | "cover"; firstMm: number; flangeMm: number },
): JointDesign {
  const { materialId, withWasher, plateMaterial } = BOLTING[bolting.kind];
  const plate = (role: "flange" | "cover", thicknessMm: number): Layer => ({
    role,
    thicknessMm,
    materialName: plateMaterial,
    modulusMpa: STEEL_MODULUS_MPA,
  });
  const design: Omit<JointDesign, "bolts"> = {
    ...base(meta),
    ...parts,
    fastener: buildFastener({
      designation: bolting.designation,
      materialId,
      holeDiameterMm: bolting.holeDiameterMm,
      clampedMm: plates.firstMm + plates.flangeMm + parts.gasket.material.thicknessMm,
      withWasher,
    }),
    layers: [plate(plates.first, plates.firstMm), { role: "gasket" }, plate("flange", plates.flangeMm)],
  };
  return { ...design, bolts: placeBoltsEqually(getBoltPathLengthMm(design), bolting.count) };
}

export function buildCircularFlange(meta: DocumentMeta, p: CircularFlangeParams): JointDesign {
  return roundFlange(meta, p, "ring");
}

/** The Full-face round flange: the round flange pair with a gasket over the whole face, through the holes. */
export function buildFullFaceFlange(meta: DocumentMeta, p: CircularFlangeParams): JointDesign {
  return roundFlange(meta, p, "full-face");
}

function roundFlange(meta: DocumentMeta, p: CircularFlangeParams, form: "ring" | "full-face"): JointDesign {
  const d = nominalDiameterMm(p.boltSize);
  const hole = metricHoleDiameterMm(d);
  const gasket = gasketMaterialFromCatalogue(
    form === "ring" ? DEFAULT_GASKET_TYPE_ID : FULL_FACE_GASKET_TYPE_ID,
  );
  const innerDiameterMm = p.boreDiameterMm > 0 ? p.boreDiameterMm + 2 * GAP_MM : 2 * GAP_MM;
  return boltedJoint(
    meta,
    {
      outline: { kind: "circle", diameterMm: p.outsideDiameterMm },
      bore: p.boreDiameterMm > 0 ? { kind: "circle", diameterMm: p.boreDiameterMm } : null,
      gasket:
        form === "full-face"
          ? { kind: "full-face", material: gasket }
          : {
              kind: "ring",
              geometry: {
                kind: "annulus",
                innerDiameterMm,
                outerDiameterMm: p.boltCircleDiameterMm - hole - 2 * GAP_MM,
              },
              material: gasket,
            },
      boltPath: { kind: "circle", diameterMm: p.boltCircleDiameterMm },
    },
    { kind: "metric", designation: p.boltSize, holeDiameterMm: hole, count: p.boltCount },
    { first: "flange", firstMm: p.flangeThicknessMm, flangeMm: p.flangeThicknessMm },
  );
}

export function pipeFlangeRow(id: string): FlangeTemplateRow | undefined {
  const row = getFlangeTemplateById(id);
  return row && PIPE_OUTSIDE_DIAMETER_MM[row.nps] ? row : undefined;
}

export function buildPipeFlange(meta: DocumentMeta, p: PipeFlangeParams): JointDesign {
  const row = pipeFlangeRow(p.flangeTemplateId);
  if (!row) throw new Error(`unknown flange template ${p.flangeTemplateId}`);
  const pipeOd = PIPE_OUTSIDE_DIAMETER_MM[row.nps];
  const gasket = gasketMaterialFromCatalogue(DEFAULT_PIPE_GASKET_TYPE_ID);
  return boltedJoint(
    meta,
    {
      templateId: row.id,
      outline: { kind: "circle", diameterMm: row.outsideDiameterMm },
      bore: { kind: "circle", diameterMm: pipeOd },
      gasket: {
        kind: "ring",
        geometry: {
          kind: "annulus",
          innerDiameterMm: pipeOd + 2 * GAP_MM,
          outerDiameterMm: row.boltCircleDiameterMm - row.holeDiameterMm - 2 * GAP_MM,
        },
        material: gasket,
      },
      boltPath: { kind: "circle", diameterMm: row.boltCircleDiameterMm },
    },
    {
      kind: "pipe",
      designation: row.boltDesignation,
      holeDiameterMm: row.holeDiameterMm,
      count: row.boltCount,
    },
    { first: "flange", firstMm: p.flangeThicknessMm, flangeMm: p.flangeThicknessMm },
  );
}

/** Where a cover's gasket band and opening sit, measured inward from the outline, mm. */
export function coverBandLayout(p: CoverParams): {
  holeDiameterMm: number;
  bandCentreOffsetMm: number;
  boreOffsetMm: number;
} {
  const holeDiameterMm = metricHoleDiameterMm(nominalDiameterMm(p.boltSize));
  const bandCentreOffsetMm = p.boltEdgeDistanceMm + holeDiameterMm / 2 + GAP_MM + p.gasketWidthMm / 2;
  return {
    holeDiameterMm,
    bandCentreOffsetMm,
    boreOffsetMm: bandCentreOffsetMm + p.gasketWidthMm / 2 + GAP_MM,
  };
}

function buildCover(meta: DocumentMeta, p: CoverParams, outline: Outline, bore: Outline | null): JointDesign {
  const { holeDiameterMm, bandCentreOffsetMm } = coverBandLayout(p);
  const gasket = gasketMaterialFromCatalogue(DEFAULT_GASKET_TYPE_ID);
  return boltedJoint(
    meta,
    {
      outline,
      bore,
      gasket: {
        kind: "ring",
        geometry: { kind: "band", centreOffsetMm: bandCentreOffsetMm, widthMm: p.gasketWidthMm },
        material: gasket,
      },
      boltPath: { kind: "offset", offsetMm: p.boltEdgeDistanceMm },
    },
    { kind: "metric", designation: p.boltSize, holeDiameterMm, count: p.boltCount },
    { first: "cover", firstMm: p.coverThicknessMm, flangeMm: p.flangeThicknessMm },
  );
}

export function buildRectangularCover(meta: DocumentMeta, p: RectangularCoverParams): JointDesign {
  const k = coverBandLayout(p).boreOffsetMm;
  const opening =
    p.widthMm - 2 * k > 0 && p.heightMm - 2 * k > 0
      ? {
          kind: "rectangle" as const,
          widthMm: p.widthMm - 2 * k,
          heightMm: p.heightMm - 2 * k,
          cornerRadiusMm: Math.max(p.cornerRadiusMm - k, 0),
        }
      : null;
  return buildCover(
    meta,
    p,
    { kind: "rectangle", widthMm: p.widthMm, heightMm: p.heightMm, cornerRadiusMm: p.cornerRadiusMm },
    opening,
  );
}

export function buildObroundManway(meta: DocumentMeta, p: ObroundManwayParams): JointDesign {
  const k = coverBandLayout(p).boreOffsetMm;
  const opening =
    p.lengthMm - 2 * k > 0 && p.widthMm - 2 * k > 0
      ? { kind: "obround" as const, lengthMm: p.lengthMm - 2 * k, widthMm: p.widthMm - 2 * k }
      : null;
  return buildCover(meta, p, { kind: "obround", lengthMm: p.lengthMm, widthMm: p.widthMm }, opening);
}

/** A polygon cover has no opening drawn (a mitred inward offset is left to the editor). */
export function buildPolygonCover(meta: DocumentMeta, p: PolygonCoverParams): JointDesign {
  return buildCover(meta, p, { kind: "polygon", points: p.points.map(({ x, y }) => ({ x, y })) }, null);
}

export function buildDesignFromTemplate(meta: DocumentMeta, input: TemplateInput): JointDesign {
  switch (input.kind) {
    case "circular-flange":
      return buildCircularFlange(meta, input);
    case "full-face-flange":
      return buildFullFaceFlange(meta, input);
    case "pipe-flange":
      return buildPipeFlange(meta, input);
    case "rectangular-cover":
      return buildRectangularCover(meta, input);
    case "obround-manway":
      return buildObroundManway(meta, input);
    case "polygon-cover":
      return buildPolygonCover(meta, input);
  }
}
