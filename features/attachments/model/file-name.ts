// A stored file name is only a label: path parts and control characters are removed, and the
// extension is made to match the detected content so a download opens in the right program.
const EXTENSIONS = { pdf: ".pdf", png: ".png", jpeg: ".jpg", dxf: ".dxf" } as const;

export function cleanFileName(raw: string, kind: keyof typeof EXTENSIONS): string {
  const base = raw.split(/[\\/]/).pop() ?? "";
  let name =
    base
      .replace(/[\u0000-\u001f\u007f"]/g, "")
      .trim()
      .slice(0, 180) || "attachment";
  const ext = EXTENSIONS[kind];
  const lower = name.toLowerCase();
  const matches = kind === "jpeg" ? lower.endsWith(".jpg") || lower.endsWith(".jpeg") : lower.endsWith(ext);
  if (!matches) name += ext;
  return name;
}
