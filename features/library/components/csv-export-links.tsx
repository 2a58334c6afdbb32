import { buttonStyles } from "@/features/ui/button-styles";

// The Stockroom's two CSV exports: plain (UTF-8, LF) and for spreadsheets (UTF-8 with BOM, CRLF),
// which spreadsheet programs open directly with °, µ and other signs intact.
export function CsvExportLinks({ endpoint }: { endpoint: string }) {
  return (
    <>
      <a href={endpoint} className={buttonStyles.secondary} download>
        Export CSV
      </a>
      <a href={`${endpoint}?variant=spreadsheet`} className={buttonStyles.secondary} download>
        Export for spreadsheets
      </a>
    </>
  );
}
