import { buttonStyles } from "@/features/ui/button-styles";

// Download links of the shop documents of one revision (the exports feature serves them).
export function ExportLinks({ designId, number }: { designId: string; number: number }) {
  const base = `/api/v1/designs/${designId}/revisions/${number}`;
  return (
    <nav aria-label="Shop documents" className="flex flex-wrap gap-2">
      <a className={buttonStyles.secondary} href={`${base}/sheet.pdf`}>
        Bolt-spacing sheet (PDF)
      </a>
      <a className={buttonStyles.secondary} href={`${base}/holes.csv`}>
        Hole table (CSV)
      </a>
      <a className={buttonStyles.secondary} href={`${base}/drilling.dxf`}>
        Drilling drawing (DXF)
      </a>
    </nav>
  );
}
