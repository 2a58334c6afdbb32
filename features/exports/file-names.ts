// Download names of the shop files (our own pattern, listed in the DEVELOPERS.md glossary):
// <tag-or-name>-rev<N>-spacing-sheet.pdf, …-hole-list.csv, …-drilling-template.dxf.
export type ExportKind = "spacing-sheet" | "hole-list" | "drilling-template";

const SUFFIX: Record<ExportKind, string> = {
  "spacing-sheet": "spacing-sheet.pdf",
  "hole-list": "hole-list.csv",
  "drilling-template": "drilling-template.dxf",
};

export const CONTENT_TYPES: Record<ExportKind, string> = {
  "spacing-sheet": "application/pdf",
  "hole-list": "text/csv; charset=utf-8",
  "drilling-template": "application/dxf",
};

/** `exportFileName({ equipmentTag: "E-2107", designName: "…" }, 3, "hole-list")` → "e-2107-rev3-hole-list.csv". */
export function exportFileName(
  design: { equipmentTag: string; designName: string },
  revisionNumber: number,
  kind: ExportKind,
): string {
  const base =
    (design.equipmentTag.trim() || design.designName)
      .normalize("NFKD")
      .replace(/[\u0300-\u036f]/g, "") // accents dropped: "Flänge" → "flange"
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-+|-+$/g, "")
      .slice(0, 60) || "design";
  return `${base}-rev${revisionNumber}-${SUFFIX[kind]}`;
}

/** Content-Disposition for a download (the name is ASCII by construction). */
export function attachmentDisposition(fileName: string): string {
  return `attachment; filename="${fileName}"`;
}
