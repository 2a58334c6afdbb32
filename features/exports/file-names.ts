// Download names of the shop files (our own pattern, listed in the DEVELOPERS.md glossary):
// <tag>-<name>-<design id, 8 hex>-rev<N>-spacing-sheet.pdf, …-hole-list.csv, …-drilling-template.dxf,
// …-bolting-kit.csv, …-pass-log.csv, …-pass-log.pdf.
export type ExportKind =
  "spacing-sheet" | "hole-list" | "drilling-template" | "bolting-kit" | "pass-log" | "pass-log-sheet";

const SUFFIX: Record<ExportKind, string> = {
  "spacing-sheet": "spacing-sheet.pdf",
  "hole-list": "hole-list.csv",
  "drilling-template": "drilling-template.dxf",
  "bolting-kit": "bolting-kit.csv",
  "pass-log": "pass-log.csv",
  "pass-log-sheet": "pass-log.pdf",
};

export const CONTENT_TYPES: Record<ExportKind, string> = {
  "spacing-sheet": "application/pdf",
  "hole-list": "text/csv; charset=utf-8",
  "drilling-template": "application/dxf",
  "bolting-kit": "text/csv; charset=utf-8",
  "pass-log": "text/csv; charset=utf-8",
  "pass-log-sheet": "application/pdf",
};

function slug(text: string, max: number): string {
  return text
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "") // accents dropped: "Flänge" → "flange"
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, max)
    .replace(/-+$/, "");
}

/**
 * `exportFileName({ equipmentTag: "E-2107", designName: "Channel cover", designId: "3f2a9c1e-…" }, 3, "hole-list")`
 * → "e-2107-channel-cover-3f2a9c1e-rev3-hole-list.csv". The tag, the design name and the start of the
 * design's id all go in, so two designs of one equipment tag (even of one name) never share a file name.
 */
export function exportFileName(
  design: { equipmentTag: string; designName: string; designId: string },
  revisionNumber: number,
  kind: ExportKind,
): string {
  const tag = slug(design.equipmentTag.trim(), 30);
  let name = slug(design.designName, 60);
  // A name that starts with the tag ("E-2107 inlet nozzle") does not repeat it.
  if (tag && (name === tag || name.startsWith(`${tag}-`))) name = name.slice(tag.length + 1);
  const base = [tag, name].filter(Boolean).join("-").slice(0, 80).replace(/-+$/, "") || "design";
  const id = design.designId
    .replace(/[^0-9a-f]/gi, "")
    .slice(0, 8)
    .toLowerCase();
  return `${[base, id].filter(Boolean).join("-")}-rev${revisionNumber}-${SUFFIX[kind]}`;
}

/** Content-Disposition for a download (the name is ASCII by construction). */
export function attachmentDisposition(fileName: string): string {
  return `attachment; filename="${fileName}"`;
}
