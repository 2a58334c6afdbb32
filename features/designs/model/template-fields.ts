// What the new-design form asks for each template: labels, units and starting values. The names
// match the template schemas (../template-schema.ts), so each server message lands on its input.
import type { TemplateKind } from "./templates";

export interface TemplateField {
  name: string;
  label: string;
  unit?: string;
  defaultValue: string;
  input: "number" | "bolt-size" | "pipe-flange" | "vertices";
  hint?: string;
}

export interface TemplateChoice {
  kind: TemplateKind;
  label: string;
  description: string;
  fields: TemplateField[];
}

const mm = (name: string, label: string, defaultValue: string, hint?: string): TemplateField => ({
  name,
  label,
  unit: "mm",
  defaultValue,
  input: "number",
  hint,
});
const count = (defaultValue: string): TemplateField => ({
  name: "boltCount",
  label: "Number of bolts",
  defaultValue,
  input: "number",
  hint: "Placed at equal pitch, straddling the centre lines",
});
const size = (defaultValue: string): TemplateField => ({
  name: "boltSize",
  label: "Bolt size",
  defaultValue,
  input: "bolt-size",
});

const coverFields = (bolts: string): TemplateField[] => [
  mm("boltEdgeDistanceMm", "Bolt edge distance", "35", "From the outer edge to the bolt centres"),
  count(bolts),
  size("M20"),
  mm("coverThicknessMm", "Cover thickness", "30"),
  mm("flangeThicknessMm", "Flange thickness", "30"),
  mm("gasketWidthMm", "Gasket width", "20", "The band sits inside the bolts"),
];

// The ring-gasket and the full-face round flange take the same dimensions.
const roundFlangeFields: TemplateField[] = [
  mm("outsideDiameterMm", "Outside diameter", "400"),
  mm("boreDiameterMm", "Bore diameter", "200", "0 for a blind flange"),
  mm("boltCircleDiameterMm", "Bolt circle diameter", "340"),
  count("12"),
  size("M20"),
  mm("flangeThicknessMm", "Flange thickness", "30"),
];

export const TEMPLATE_CHOICES: readonly TemplateChoice[] = [
  {
    kind: "circular-flange",
    label: "Round flange by dimensions",
    description: "A circular flange pair with a bore, sized by its outside and bolt circle diameters.",
    fields: roundFlangeFields,
  },
  {
    kind: "full-face-flange",
    label: "Full-face round flange",
    description:
      "A round flange pair with one gasket sheet over the whole face, through the bolt holes (elastomer with fabric insertion).",
    fields: roundFlangeFields,
  },
  {
    kind: "pipe-flange",
    label: "Catalogue pipe flange",
    description: "ASME B16.5 Class 150 outside diameter, bolt circle and bolting from the catalogue.",
    fields: [
      {
        name: "flangeTemplateId",
        label: "Pipe flange size",
        defaultValue: "asme-b16.5-cl150-nps6",
        input: "pipe-flange",
      },
      mm("flangeThicknessMm", "Flange thickness", "25", "Take it from the flange drawing"),
    ],
  },
  {
    kind: "rectangular-cover",
    label: "Rectangular cover",
    description: "A bolted rectangular hatch or channel cover with rounded corners.",
    fields: [
      mm("widthMm", "Width", "600"),
      mm("heightMm", "Height", "400"),
      mm("cornerRadiusMm", "Corner radius", "40"),
      ...coverFields("16"),
    ],
  },
  {
    kind: "obround-manway",
    label: "Obround manway",
    description: "A manway cover with two straight sides and round ends.",
    fields: [mm("lengthMm", "Length", "600"), mm("widthMm", "Width", "450"), ...coverFields("16")],
  },
  {
    kind: "polygon-cover",
    label: "Polygon cover",
    description: "Any straight-sided cover, given by its vertices.",
    fields: [
      {
        name: "points",
        label: "Vertices (x, y in mm, one per line)",
        defaultValue: "-300, -200\n300, -200\n300, 150\n0, 250\n-300, 150",
        input: "vertices",
      },
      ...coverFields("14"),
    ],
  },
];
